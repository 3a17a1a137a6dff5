/** Findings about a file that cannot be read or stops short: shared by the raster checks. */
import { formatName } from "../sniff";
import type { ArtworkFormat, Finding } from "../types";

/** A file whose header cannot be read at all. */
export function unreadableFinding(format: ArtworkFormat, error: unknown): Finding {
  return {
    code: "file-damaged",
    severity: "blocker",
    message: `The file starts like a ${formatName(format)} image but cannot be read (${errorText(error)}).`,
    fix: "Export it again from your drawing or photo program and upload the new file.",
  };
}

/** A file whose header reads but whose pixels do not; cut-short files are told apart by the decoder's words. */
export function decodeFailureFinding(format: ArtworkFormat, error: unknown): Finding {
  const text = errorText(error);
  if (/premature|truncat|end of|read error|unexpected end/i.test(text))
    return truncatedFinding(format);
  return {
    code: "file-damaged",
    severity: "blocker",
    message: `The ${formatName(format)} header reads, but the picture inside does not (${text}).`,
    fix: "Export it again from your drawing or photo program and upload the new file.",
  };
}

/** A file that ends before its format says it should. */
export function truncatedFinding(format: ArtworkFormat): Finding {
  return {
    code: "file-truncated",
    severity: "blocker",
    message: `The ${formatName(format)} file stops before its end; the upload was cut short or the file is damaged.`,
    fix: "Upload the file again; if it still fails, export a new copy.",
  };
}

function errorText(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
