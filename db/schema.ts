/**
 * The one data model of Quireline. Lengths are millimetres, money is integer cents with a
 * currency code, times are UTC. Auth.js tables keep the shape its Drizzle adapter expects.
 */
import {
  bigint,
  boolean,
  char,
  customType,
  date,
  datetime,
  double,
  index,
  int,
  json,
  mysqlTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  varchar,
} from "drizzle-orm/mysql-core";
import type { AdapterAccountType } from "next-auth/adapters";
import {
  ANTHOLOGY_STAGES,
  BINDINGS,
  COVER_STOCKS,
  FEE_KINDS,
  PIECE_KINDS,
  PIECE_STATUSES,
  PRINT_METHODS,
  PRINT_OUTPUT_KINDS,
  PRINT_OUTPUT_STATES,
  LEDGER_KINDS,
  LEDGER_SOURCES,
  ROLES,
  SALE_CHANNELS,
  SHARE_SPLITS,
  SLOT_RESERVATIONS,
  TRANSFER_STATES,
  type AnthologyStage,
  type Binding,
  type CoverStock,
  type FeeKind,
  type LedgerKind,
  type LedgerSource,
  type SaleChannel,
  type ShareSplit,
  type TransferState,
  type PieceKind,
  type PieceStatus,
  type PrintMethod,
  type PrintOutputKind,
  type PrintOutputState,
  type Role,
  type SlotReservation,
} from "../lib/domain";
import type { LedgerComputation } from "../lib/payouts";
import type { EventKind, PrintMode } from "../lib/run/batches";
import type { PriceList, QuoteTier, StepTimings } from "../lib/run/prices";
import type { StockKind } from "../lib/run/stock";
import { LENGTH } from "../lib/validations/limits";

const id = () => bigint("id", { mode: "number", unsigned: true }).autoincrement().primaryKey();
const ref = (name: string) => bigint(name, { mode: "number", unsigned: true });
const userRef = (name: string) => varchar(name, { length: 255 });
const createdAt = () =>
  datetime("created_at", { mode: "date", fsp: 3 })
    .notNull()
    .$defaultFn(() => new Date());
const updatedAt = () =>
  datetime("updated_at", { mode: "date", fsp: 3 })
    .notNull()
    .$defaultFn(() => new Date())
    .$onUpdateFn(() => new Date());

const mediumBlob = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => "mediumblob",
});

/* ---------- Auth.js ---------- */

export const users = mysqlTable("user", {
  id: varchar("id", { length: 255 })
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID()),
  name: varchar("name", { length: LENGTH.personName }),
  email: varchar("email", { length: LENGTH.email }).unique(),
  emailVerified: timestamp("emailVerified", { mode: "date", fsp: 3 }),
  image: varchar("image", { length: 255 }),
  /** argon2id hash; null for people who only ever sign in by e-mail link. */
  passwordHash: varchar("password_hash", { length: 255 }),
  /**
   * Bumped by sign-out, a password change and the removal of a role; a session token that
   * carries an older number is no longer honoured.
   */
  sessionVersion: int("session_version").notNull().default(0),
  createdAt: datetime("created_at", { mode: "date", fsp: 3 }).$defaultFn(() => new Date()),
});

export const accounts = mysqlTable(
  "account",
  {
    userId: userRef("userId")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    type: varchar("type", { length: 255 }).$type<AdapterAccountType>().notNull(),
    provider: varchar("provider", { length: 255 }).notNull(),
    providerAccountId: varchar("providerAccountId", { length: 255 }).notNull(),
    refresh_token: varchar("refresh_token", { length: 255 }),
    access_token: varchar("access_token", { length: 255 }),
    expires_at: int("expires_at"),
    token_type: varchar("token_type", { length: 255 }),
    scope: varchar("scope", { length: 255 }),
    id_token: varchar("id_token", { length: 2048 }),
    session_state: varchar("session_state", { length: 255 }),
  },
  (t) => [primaryKey({ columns: [t.provider, t.providerAccountId] })],
);

export const sessions = mysqlTable("session", {
  sessionToken: varchar("sessionToken", { length: 255 }).primaryKey(),
  userId: userRef("userId")
    .notNull()
    .references(() => users.id, { onDelete: "cascade" }),
  expires: timestamp("expires", { mode: "date" }).notNull(),
});

export const verificationTokens = mysqlTable(
  "verificationToken",
  {
    identifier: varchar("identifier", { length: LENGTH.email }).notNull(),
    token: varchar("token", { length: 255 }).notNull(),
    expires: timestamp("expires", { mode: "date" }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.identifier, t.token] })],
);

/* ---------- Anthologies and people ---------- */

export const anthologies = mysqlTable("anthology", {
  id: id(),
  slug: varchar("slug", { length: 80 }).notNull().unique(),
  title: varchar("title", { length: LENGTH.anthologyTitle }).notNull(),
  pressName: varchar("press_name", { length: LENGTH.pressName }),
  summary: text("summary"),
  stage: varchar("stage", { length: 24, enum: ANTHOLOGY_STAGES })
    .$type<AnthologyStage>()
    .notNull()
    .default("planning"),
  trimPreset: varchar("trim_preset", { length: 32 }).notNull(),
  trimWidthMm: double("trim_width_mm").notNull(),
  trimHeightMm: double("trim_height_mm").notNull(),
  bleedMm: double("bleed_mm").notNull(),
  safeMarginMm: double("safe_margin_mm").notNull(),
  binding: varchar("binding", { length: 24, enum: BINDINGS }).$type<Binding>().notNull(),
  pageCountTarget: int("page_count_target").notNull(),
  maxPages: int("max_pages").notNull(),
  coverStock: varchar("cover_stock", { length: 16, enum: COVER_STOCKS })
    .$type<CoverStock>()
    .notNull(),
  coverPaperGsm: int("cover_paper_gsm"),
  paperGsm: int("paper_gsm").notNull(),
  paperCaliperMm: double("paper_caliper_mm").notNull(),
  printMethod: varchar("print_method", { length: 24, enum: PRINT_METHODS })
    .$type<PrintMethod>()
    .notNull(),
  /** Ink names in press order, e.g. ["black", "fluorescent pink"]; one drum pass each. */
  inks: json("inks").$type<string[]>().notNull(),
  /** Inks the press can lay in one pass over a sheet side (duplicators: usually 1). */
  inksPerPass: int("inks_per_pass").notNull().default(1),
  minPpi: int("min_ppi").notNull(),
  currency: char("currency", { length: 3 }).notNull().default("USD"),
  /** Bumped on every page-map change; stale map edits are refused. */
  mapVersion: int("map_version").notNull().default(0),
  /** Copies the editor plans to print; the page map's pass figures use it and its sheet view changes it. */
  plannedCopies: int("planned_copies").notNull().default(100),
  createdBy: userRef("created_by").notNull(),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const memberships = mysqlTable(
  "membership",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    userId: userRef("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: varchar("role", { length: 16, enum: ROLES }).$type<Role>().notNull(),
    /** An editor or lead who asked to be e-mailed when a piece is submitted. */
    notifyNewPieces: boolean("notify_new_pieces").notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("membership_person").on(t.anthologyId, t.userId),
    index("membership_user").on(t.userId),
  ],
);

export const invitations = mysqlTable(
  "invitation",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    email: varchar("email", { length: LENGTH.email }).notNull(),
    role: varchar("role", { length: 16, enum: ROLES }).$type<Role>().notNull(),
    /** sha256 of the token sent by e-mail; the token itself is never stored. */
    tokenHash: char("token_hash", { length: 64 }).notNull().unique(),
    invitedBy: userRef("invited_by").notNull(),
    expiresAt: datetime("expires_at", { mode: "date" }).notNull(),
    acceptedAt: datetime("accepted_at", { mode: "date" }),
    acceptedBy: userRef("accepted_by"),
    revokedAt: datetime("revoked_at", { mode: "date" }),
    revokedBy: userRef("revoked_by"),
    createdAt: createdAt(),
  },
  (t) => [index("invitation_anthology").on(t.anthologyId)],
);

/* ---------- Open call and submissions ---------- */

export const calls = mysqlTable("open_call", {
  id: id(),
  anthologyId: ref("anthology_id")
    .notNull()
    .unique()
    .references(() => anthologies.id, { onDelete: "cascade" }),
  theme: varchar("theme", { length: LENGTH.callTheme }).notNull(),
  brief: text("brief").notNull(),
  opensAt: datetime("opens_at", { mode: "date" }).notNull(),
  closesAt: datetime("closes_at", { mode: "date" }).notNull(),
  /** IANA zone the editor wrote the dates in, for display. */
  timeZone: varchar("time_zone", { length: LENGTH.timeZone }).notNull(),
  allowedKinds: json("allowed_kinds").$type<PieceKind[]>().notNull(),
  maxRunPages: int("max_run_pages").notNull().default(4),
  piecesPerPerson: int("pieces_per_person").notNull().default(2),
  allowedInks: json("allowed_inks").$type<string[]>().notNull(),
  feeKind: varchar("fee_kind", { length: 16, enum: FEE_KINDS })
    .$type<FeeKind>()
    .notNull()
    .default("none"),
  feeCents: int("fee_cents").notNull().default(0),
  /** Contributors' pooled share of net sales, in basis points (1 % = 100). */
  salesShareBasisPoints: int("sales_share_bp").notNull().default(0),
  /** How the contributors' share is divided among them: by pieces, by pages or equally. */
  shareSplit: varchar("share_split", { length: 16, enum: SHARE_SPLITS })
    .$type<ShareSplit>()
    .notNull()
    .default("per-page"),
  contributorCopies: int("contributor_copies").notNull().default(1),
  rightsAsked: text("rights_asked").notNull(),
  publishedAt: datetime("published_at", { mode: "date" }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const pieces = mysqlTable(
  "piece",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    contributorId: userRef("contributor_id")
      .notNull()
      .references(() => users.id),
    title: varchar("title", { length: LENGTH.pieceTitle }).notNull(),
    kind: varchar("kind", { length: 16, enum: PIECE_KINDS }).$type<PieceKind>().notNull(),
    pageCount: int("page_count").notNull(),
    inks: json("inks").$type<string[]>().notNull(),
    creditLine: varchar("credit_line", { length: LENGTH.creditLine }).notNull(),
    creditApprovedAt: datetime("credit_approved_at", { mode: "date" }),
    /** When the contributor was last asked by e-mail to approve the credit line; cleared on approval. */
    creditRequestedAt: datetime("credit_requested_at", { mode: "date", fsp: 3 }),
    statement: text("statement"),
    status: varchar("status", { length: 24, enum: PIECE_STATUSES })
      .$type<PieceStatus>()
      .notNull()
      .default("awaiting-review"),
    /** Worst severity over the current file of every page: blocker, warning, note, pass or missing. */
    verdict: varchar("verdict", { length: 16 }).notNull().default("missing"),
    /** Kept out of the map when accepted but deliberately left out of this issue. */
    leftOut: boolean("left_out").notNull().default(false),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("piece_anthology").on(t.anthologyId, t.status),
    index("piece_contributor").on(t.contributorId),
  ],
);

export const piecePages = mysqlTable(
  "piece_page",
  {
    id: id(),
    pieceId: ref("piece_id")
      .notNull()
      .references(() => pieces.id, { onDelete: "cascade" }),
    /** 1-based position inside the piece. */
    pageIndex: int("page_index").notNull(),
    altText: text("alt_text"),
    currentVersionId: ref("current_version_id"),
    /** Bumped whenever the current version changes: the guard against two tabs replacing at once. */
    revision: int("revision").notNull().default(0),
  },
  (t) => [uniqueIndex("piece_page_position").on(t.pieceId, t.pageIndex)],
);

export const fileVersions = mysqlTable(
  "file_version",
  {
    id: id(),
    piecePageId: ref("piece_page_id")
      .notNull()
      .references(() => piecePages.id, { onDelete: "cascade" }),
    versionNumber: int("version_number").notNull(),
    storageKey: varchar("storage_key", { length: 128 }).notNull(),
    fileName: varchar("file_name", { length: 255 }).notNull(),
    mimeType: varchar("mime_type", { length: 100 }).notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number", unsigned: true }).notNull(),
    md5: char("md5", { length: 32 }),
    /**
     * For a stencil duplicator's separations: the ink this greyscale master is for (one drum pass).
     * Null for a composite page file.
     */
    ink: varchar("ink", { length: 40 }),
    /** The print engine's report: measured values and findings. */
    report: json("report").notNull(),
    verdict: varchar("verdict", { length: 16 }).notNull(),
    thumbnailWebp: mediumBlob("thumbnail_webp"),
    thumbnailWidthPx: int("thumbnail_width_px"),
    thumbnailHeightPx: int("thumbnail_height_px"),
    uploadedBy: userRef("uploaded_by").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("file_version_number").on(t.piecePageId, t.versionNumber)],
);

/**
 * One ink's separation of a piece page, for duplicator anthologies where a piece uses two or more
 * inks: the current master for that ink and the revision guard, as piece_page has for composites.
 */
export const pageSeparations = mysqlTable(
  "page_separation",
  {
    id: id(),
    piecePageId: ref("piece_page_id")
      .notNull()
      .references(() => piecePages.id, { onDelete: "cascade" }),
    ink: varchar("ink", { length: 40 }).notNull(),
    currentVersionId: ref("current_version_id"),
    revision: int("revision").notNull().default(0),
  },
  (t) => [uniqueIndex("page_separation_ink").on(t.piecePageId, t.ink)],
);

export const pieceEvents = mysqlTable(
  "piece_event",
  {
    id: id(),
    pieceId: ref("piece_id")
      .notNull()
      .references(() => pieces.id, { onDelete: "cascade" }),
    actorId: userRef("actor_id"),
    fromStatus: varchar("from_status", { length: 24 }),
    toStatus: varchar("to_status", { length: 24 }).notNull(),
    message: text("message"),
    createdAt: createdAt(),
  },
  (t) => [index("piece_event_piece").on(t.pieceId)],
);

export const editorNotes = mysqlTable(
  "editor_note",
  {
    id: id(),
    pieceId: ref("piece_id")
      .notNull()
      .references(() => pieces.id, { onDelete: "cascade" }),
    authorId: userRef("author_id").notNull(),
    body: text("body").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("editor_note_piece").on(t.pieceId)],
);

/* ---------- Page map ---------- */

export const pageSlots = mysqlTable(
  "page_slot",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    /** Reader page number, 1 = front cover. */
    pageNumber: int("page_number").notNull(),
    reservation: varchar("reservation", {
      length: 16,
      enum: SLOT_RESERVATIONS,
    }).$type<SlotReservation>(),
    pieceId: ref("piece_id").references(() => pieces.id, { onDelete: "set null" }),
    /** Which page of the piece sits here (1-based). */
    piecePageIndex: int("piece_page_index"),
    locked: boolean("locked").notNull().default(false),
  },
  (t) => [uniqueIndex("page_slot_number").on(t.anthologyId, t.pageNumber)],
);

export const mapEvents = mysqlTable(
  "map_event",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    actorId: userRef("actor_id").notNull(),
    mapVersion: int("map_version").notNull(),
    action: varchar("action", { length: 32 }).notNull(),
    detail: json("detail").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("map_event_anthology").on(t.anthologyId)],
);

/* ---------- Print files ---------- */

/**
 * One produced file: an imposed print PDF (composite, or one ink's masters for a duplicator), a
 * reader proof or a credits page. Made by the print worker off the request; a failed run keeps its
 * message and leaves the last good output of that kind untouched.
 */
export const printOutputs = mysqlTable(
  "print_output",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    kind: varchar("kind", { length: 16, enum: PRINT_OUTPUT_KINDS })
      .$type<PrintOutputKind>()
      .notNull(),
    /** The ink of a duplicator master; null for composites, proofs and credits. */
    ink: varchar("ink", { length: 40 }),
    state: varchar("state", { length: 16, enum: PRINT_OUTPUT_STATES })
      .$type<PrintOutputState>()
      .notNull()
      .default("queued"),
    /** The BullMQ job that makes it. */
    jobId: varchar("job_id", { length: 64 }),
    /** The map version the output was made from; older than the anthology's means stale. */
    mapVersion: int("map_version").notNull(),
    /** Press sheet, portrait, in millimetres (null for a proof or credits page). */
    sheetWidthMm: double("sheet_width_mm"),
    sheetHeightMm: double("sheet_height_mm"),
    sheetName: varchar("sheet_name", { length: 40 }),
    pagesDone: int("pages_done").notNull().default(0),
    pagesTotal: int("pages_total").notNull().default(0),
    storageKey: varchar("storage_key", { length: 128 }),
    fileName: varchar("file_name", { length: 255 }),
    sizeBytes: bigint("size_bytes", { mode: "number", unsigned: true }),
    pageCount: int("page_count"),
    /** Set when the map or a file it used changed after it was made. */
    staleAt: datetime("stale_at", { mode: "date", fsp: 3 }),
    error: text("error"),
    requestedBy: userRef("requested_by").notNull(),
    createdAt: createdAt(),
    finishedAt: datetime("finished_at", { mode: "date", fsp: 3 }),
  },
  (t) => [index("print_output_anthology").on(t.anthologyId, t.kind)],
);

/* ---------- Rate limits ---------- */

/**
 * Counts kept by rate-limiter-flexible's MySQL store (server/rate-limit.ts): one row per limited
 * key ("signInAccount:someone@example.test"), the tries used and when the window ends (ms).
 */
export const rateLimits = mysqlTable("rate_limit", {
  key: varchar("key", { length: 255 }).primaryKey(),
  points: int("points").notNull().default(0),
  expire: bigint("expire", { mode: "number", unsigned: true }),
});

/* ---------- Mail ---------- */

export const emailLog = mysqlTable(
  "email_log",
  {
    id: id(),
    anthologyId: ref("anthology_id"),
    pieceId: ref("piece_id"),
    toEmail: varchar("to_email", { length: LENGTH.email }).notNull(),
    subject: varchar("subject", { length: 255 }).notNull(),
    kind: varchar("kind", { length: 40 }).notNull(),
    /** Set for mails that must go out once only (e.g. page notices). */
    dedupeKey: varchar("dedupe_key", { length: 191 }).unique(),
    error: text("error"),
    sentAt: datetime("sent_at", { mode: "date", fsp: 3 }),
    createdAt: createdAt(),
  },
  (t) => [index("email_log_anthology").on(t.anthologyId)],
);

/* ---------- Print run: prices, plan, events, batches, stock ---------- */

/**
 * A collective's prices, kept by press (the anthology's press name, or its lead when it has
 * none) so the next anthology reuses them. Cents for a pack of a quantity (lib/run/prices.ts).
 */
export const priceLists = mysqlTable(
  "price_list",
  {
    id: id(),
    pressKey: varchar("press_key", { length: LENGTH.pressKey }).notNull(),
    name: varchar("name", { length: 120 }).notNull(),
    currency: char("currency", { length: 3 }).notNull(),
    prices: json("prices").$type<PriceList>().notNull(),
    updatedBy: userRef("updated_by").notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("price_list_name").on(t.pressKey, t.name)],
);

/** A print shop's quote for finished copies, in tiers by quantity, kept by press like the price lists. */
export const shopQuotes = mysqlTable(
  "shop_quote",
  {
    id: id(),
    pressKey: varchar("press_key", { length: LENGTH.pressKey }).notNull(),
    shopName: varchar("shop_name", { length: 120 }).notNull(),
    currency: char("currency", { length: 3 }).notNull(),
    /** Ascending by copies; the first is the minimum order. */
    tiers: json("tiers").$type<QuoteTier[]>().notNull(),
    turnaroundDays: int("turnaround_days").notNull(),
    updatedBy: userRef("updated_by").notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("shop_quote_name").on(t.pressKey, t.shopName)],
);

/** An anthology's run plan: the quantities weighed, which prices and quote, finishing timings and hours. */
export const runPlans = mysqlTable("run_plan", {
  id: id(),
  anthologyId: ref("anthology_id")
    .notNull()
    .unique()
    .references(() => anthologies.id, { onDelete: "cascade" }),
  priceListId: ref("price_list_id").references(() => priceLists.id, { onDelete: "set null" }),
  shopQuoteId: ref("shop_quote_id").references(() => shopQuotes.id, { onDelete: "set null" }),
  quantities: json("quantities").$type<number[]>().notNull(),
  /** Minutes per finishing step, keyed by step id (lib/run/checklist.ts). */
  timings: json("timings").$type<StepTimings>().notNull(),
  /** The finishers' time, all together, in minutes a week. */
  minutesPerWeek: int("minutes_per_week").notNull().default(0),
  printMode: varchar("print_mode", { length: 16 })
    .$type<PrintMode>()
    .notNull()
    .default("all-at-once"),
  updatedAt: updatedAt(),
});

/** A day copies are wanted for: a fair, a launch, a mail-out. */
export const runEvents = mysqlTable(
  "run_event",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 120 }).notNull(),
    kind: varchar("kind", { length: 16 }).$type<EventKind>().notNull(),
    /** The calendar day in the anthology's zone (YYYY-MM-DD). */
    onDate: date("on_date", { mode: "string" }).notNull(),
    copies: int("copies").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("run_event_anthology").on(t.anthologyId, t.onDate)],
);

/**
 * Contributor copies owed under the call's terms: how many, how they reach the contributor
 * (collected at an event or posted) and when they were handed over or sent.
 */
export const contributorCopies = mysqlTable(
  "contributor_copy",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    contributorId: userRef("contributor_id").notNull(),
    quantity: int("quantity").notNull(),
    /** "collect" at an event or "post". */
    delivery: varchar("delivery", { length: 16 }).notNull().default("collect"),
    eventId: ref("event_id").references(() => runEvents.id, { onDelete: "set null" }),
    handedOverAt: datetime("handed_over_at", { mode: "date" }),
    doneBy: userRef("done_by"),
    note: text("note"),
  },
  (t) => [uniqueIndex("contributor_copy_person").on(t.anthologyId, t.contributorId)],
);

/** Copies finished together for one event; its checklist ticks are finishing_tick rows. */
export const finishingBatches = mysqlTable(
  "finishing_batch",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    label: varchar("label", { length: 120 }).notNull(),
    copies: int("copies").notNull(),
    position: int("position").notNull().default(0),
    eventId: ref("event_id").references(() => runEvents.id, { onDelete: "set null" }),
    /** The day the batch is wanted by, in the anthology's zone. */
    dueOn: date("due_on", { mode: "string" }),
    doneAt: datetime("done_at", { mode: "date" }),
    doneBy: userRef("done_by"),
  },
  (t) => [index("finishing_batch_anthology").on(t.anthologyId, t.position)],
);

/** One checklist step of a batch ticked done, by whom and when. */
export const finishingTicks = mysqlTable(
  "finishing_tick",
  {
    batchId: ref("batch_id")
      .notNull()
      .references(() => finishingBatches.id, { onDelete: "cascade" }),
    stepId: varchar("step_id", { length: 24 }).notNull(),
    doneBy: userRef("done_by").notNull(),
    doneAt: datetime("done_at", { mode: "date", fsp: 3 }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.batchId, t.stepId] })],
);

/**
 * One row per anthology, locked (SELECT … FOR UPDATE) by every stock movement so concurrent
 * movements are checked one after another; the counts themselves are sums of stock_movement.
 */
export const runStock = mysqlTable("run_stock", {
  anthologyId: ref("anthology_id")
    .primaryKey()
    .references(() => anthologies.id, { onDelete: "cascade" }),
  movementCount: int("movement_count").notNull().default(0),
});

/** Append-only: printed sheet sets per batch and finished copies, each change with its reason and person. */
export const stockMovements = mysqlTable(
  "stock_movement",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    // Batches with movements are never re-planned away (db/queries/run.ts); the cascade only follows a deleted anthology.
    batchId: ref("batch_id").references(() => finishingBatches.id, { onDelete: "cascade" }),
    kind: varchar("kind", { length: 24 }).$type<StockKind>().notNull(),
    /** Change to the batch's printed, unfinished sheet sets (one set = one copy's sheets). */
    sheetSets: int("sheet_sets").notNull().default(0),
    /** Change to finished copies on hand. */
    copies: int("copies").notNull().default(0),
    reason: varchar("reason", { length: 500 }).notNull().default(""),
    eventId: ref("event_id").references(() => runEvents.id, { onDelete: "set null" }),
    contributorCopyId: ref("contributor_copy_id"),
    actorId: userRef("actor_id").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("stock_movement_anthology").on(t.anthologyId, t.batchId)],
);

/* ---------- After the print run: money ---------- */

/**
 * One sale, or one batch of sales, at an event or through a channel. Amounts are integer cents in
 * the anthology's currency; net = copies x unit price - discounts - channel fees - recoverable costs.
 * Rows are never edited: a mistake is put right with another row (negative copies or amounts).
 */
export const sales = mysqlTable(
  "sale",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    channel: varchar("channel", { length: 16, enum: SALE_CHANNELS }).$type<SaleChannel>().notNull(),
    label: varchar("label", { length: LENGTH.saleLabel }).notNull(),
    soldOn: datetime("sold_on", { mode: "date" }).notNull(),
    copies: int("copies").notNull(),
    unitPriceCents: bigint("unit_price_cents", { mode: "number" }).notNull(),
    discountCents: bigint("discount_cents", { mode: "number" }).notNull().default(0),
    /** What the channel kept: a shop's commission, a card reader's fee. */
    channelFeesCents: bigint("channel_fees_cents", { mode: "number" }).notNull().default(0),
    /** Costs the terms let the press take back before the share: printing, a table fee. */
    recoverableCostsCents: bigint("recoverable_costs_cents", { mode: "number" })
      .notNull()
      .default(0),
    currency: char("currency", { length: 3 }).notNull(),
    note: varchar("note", { length: LENGTH.saleNote }),
    recordedBy: userRef("recorded_by").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("sale_anthology").on(t.anthologyId, t.soldOn)],
);

/** A stretch of dates whose net sales are shared out once, when the editor closes it. */
export const payoutPeriods = mysqlTable(
  "payout_period",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    label: varchar("label", { length: LENGTH.periodLabel }).notNull(),
    /** First and last day, inclusive, as UTC midnights. */
    startsOn: datetime("starts_on", { mode: "date" }).notNull(),
    endsOn: datetime("ends_on", { mode: "date" }).notNull(),
    /** The whole computation at closing: sales, net, pool, split, fees (see lib/payouts). */
    computation: json("computation"),
    closedAt: datetime("closed_at", { mode: "date", fsp: 3 }),
    closedBy: userRef("closed_by"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("payout_period_label").on(t.anthologyId, t.label)],
);

/**
 * The payouts ledger: append-only. A contributor's balance is the sum of their amounts (owed is
 * positive, paid negative, scheduled zero, a reversal the opposite of what it reverses). Each row
 * says how it was worked out. `dedupe_key` makes the once-only rules hold under races: one share
 * per period and person, one fee line per person, one paid line per owed line.
 */
export const payoutEntries = mysqlTable(
  "payout_entry",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    contributorId: userRef("contributor_id").notNull(),
    periodId: ref("period_id"),
    kind: varchar("kind", { length: 16, enum: LEDGER_KINDS }).$type<LedgerKind>().notNull(),
    source: varchar("source", { length: 16, enum: LEDGER_SOURCES }).$type<LedgerSource>().notNull(),
    amountCents: bigint("amount_cents", { mode: "number" }).notNull(),
    currency: char("currency", { length: 3 }).notNull(),
    /** The owed line a scheduled or paid line settles. */
    settlesEntryId: ref("settles_entry_id"),
    /** The line a reversal cancels. */
    reversesEntryId: ref("reverses_entry_id"),
    /** The terms and inputs the amount came from, and its working in words. */
    computation: json("computation").$type<LedgerComputation>().notNull(),
    /** A transfer id, or the editor's reference for a payment made by hand. */
    reference: varchar("reference", { length: LENGTH.paymentReference }),
    dedupeKey: varchar("dedupe_key", { length: 191 }).notNull().unique(),
    createdBy: userRef("created_by"),
    createdAt: createdAt(),
  },
  (t) => [index("payout_entry_person").on(t.anthologyId, t.contributorId)],
);

/** A contributor's connected account at the payments service (one per person, any anthology). */
export const payoutAccounts = mysqlTable("payout_account", {
  userId: userRef("user_id")
    .primaryKey()
    .references(() => users.id, { onDelete: "cascade" }),
  providerAccountId: varchar("provider_account_id", { length: 64 }).notNull().unique(),
  detailsSubmitted: boolean("details_submitted").notNull().default(false),
  transfersActive: boolean("transfers_active").notNull().default(false),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

/**
 * One attempt to pay an owed line by transfer. The idempotency key is per owed line and attempt,
 * so a retried request reaches the same transfer; a failed attempt lets the next one start.
 */
export const payoutTransfers = mysqlTable(
  "payout_transfer",
  {
    id: id(),
    anthologyId: ref("anthology_id")
      .notNull()
      .references(() => anthologies.id, { onDelete: "cascade" }),
    entryId: ref("entry_id").notNull(),
    attempt: int("attempt").notNull(),
    idempotencyKey: varchar("idempotency_key", { length: 64 }).notNull().unique(),
    providerTransferId: varchar("provider_transfer_id", { length: 64 }).unique(),
    destination: varchar("destination", { length: 64 }).notNull(),
    amountCents: bigint("amount_cents", { mode: "number" }).notNull(),
    currency: char("currency", { length: 3 }).notNull(),
    state: varchar("state", { length: 16, enum: TRANSFER_STATES }).$type<TransferState>().notNull(),
    error: varchar("error", { length: 500 }),
    createdBy: userRef("created_by").notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("payout_transfer_attempt").on(t.entryId, t.attempt)],
);

/** Every payments webhook event handled, by the service's event id: a replay is seen and skipped. */
export const paymentEvents = mysqlTable("payment_event", {
  id: varchar("id", { length: 64 }).primaryKey(),
  type: varchar("type", { length: 64 }).notNull(),
  outcome: varchar("outcome", { length: 255 }).notNull(),
  receivedAt: createdAt(),
});
