/**
 * What every JSON route answers when it says no (4xx, 5xx): a plain message for the person and,
 * for a body or query that failed its schema, the messages per field keyed by dotted path.
 * server/api.ts writes it; components/api/fetch-json.ts reads it.
 */
export type FieldMessages = Record<string, string[]>;

export interface ErrorAnswer {
  error: string;
  fields?: FieldMessages;
}
