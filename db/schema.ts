// Drizzle schema (MariaDB). Conventions (DEVELOPERS.md): ids are unsigned BIGINT auto-increment in
// number mode (drizzle-kit's serial() emits SQL MariaDB rejects); lucia's ids are varchar strings;
// times are DATETIME(3) in UTC; physical quantities are DOUBLE in SI units.
import { sql } from "drizzle-orm";
import {
  bigint,
  datetime,
  index,
  int,
  mysqlTable,
  uniqueIndex,
  varchar,
  mysqlEnum,
  boolean,
  text,
  mediumtext,
  double,
  customType,
  primaryKey,
} from "drizzle-orm/mysql-core";

/** LONGBLOB (drizzle has no builtin for it); values are Buffers. */
const longblob = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "longblob" });

export const id = () => bigint("id", { mode: "number", unsigned: true }).autoincrement().primaryKey();
export const ref = (name: string) => bigint(name, { mode: "number", unsigned: true });
export const createdAt = () =>
  datetime("created_at", { mode: "date", fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`);

import { PLANS, ROLES, SHARE_STATES, VISIBILITIES, type Role, type ShareState, type Visibility } from "./enums";
export { PLANS, ROLES, SHARE_STATES, VISIBILITIES, type Role, type ShareState, type Visibility };

export const workspaces = mysqlTable(
  "workspaces",
  {
    id: id(),
    name: varchar("name", { length: 120 }).notNull(),
    slug: varchar("slug", { length: 140 }).notNull(),
    plan: mysqlEnum("plan", PLANS).notNull().default("free"),
    // Billing (Stripe): changed only by verified webhooks (app/lib/billing/billing.server.ts).
    stripeCustomerId: varchar("stripe_customer_id", { length: 64 }),
    stripeSubscriptionId: varchar("stripe_subscription_id", { length: 64 }),
    subscriptionStatus: varchar("subscription_status", { length: 32 }),
    currentPeriodEnd: datetime("current_period_end", { mode: "date" }),
    cancelAtPeriodEnd: boolean("cancel_at_period_end").notNull().default(false),
    /**
     * When an Upgrade began opening a Stripe checkout for the workspace (UTC_TIMESTAMP(), written and compared in SQL
     * only: app/lib/billing/checkout-claim.server.ts); null when none is being opened. One at a time, two minutes at most.
     */
    checkoutStartedAt: datetime("checkout_started_at", { mode: "string" }),
    /** ISO 4217 code of the money the workspace's tariffs and energy costs are in. */
    currency: varchar("currency", { length: 3 }).notNull().default("EUR"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("workspaces_slug_uq").on(t.slug), uniqueIndex("workspaces_stripe_customer_uq").on(t.stripeCustomerId)],
);


export const users = mysqlTable(
  "users",
  {
    id: varchar("id", { length: 40 }).primaryKey(),
    email: varchar("email", { length: 254 }).notNull(),
    name: varchar("name", { length: 120 }).notNull().default(""),
    passwordHash: varchar("password_hash", { length: 255 }).notNull(),
    emailVerified: boolean("email_verified").notNull().default(false),
    unitSystem: mysqlEnum("unit_system", ["SI", "US"]).notNull().default("SI"),
    /** Per-quantity unit overrides over the preset, JSON text `{"flow":"L/s",…}` (checked on read: app/lib/auth/stored-units.ts). */
    units: varchar("units", { length: 1000 }).notNull().default("{}"),
    currentWorkspaceId: ref("current_workspace_id"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("users_email_uq").on(t.email)],
);

export const sessions = mysqlTable(
  "sessions",
  {
    id: varchar("id", { length: 255 }).primaryKey(),
    userId: varchar("user_id", { length: 40 })
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expiresAt: datetime("expires_at", { mode: "date" }).notNull(),
    createdAt: datetime("created_at", { mode: "date" }).notNull(),
    userAgent: varchar("user_agent", { length: 300 }).notNull().default(""),
    ipAddress: varchar("ip_address", { length: 64 }).notNull().default(""),
  },
  (t) => [index("sessions_user_idx").on(t.userId)],
);

export const memberships = mysqlTable(
  "memberships",
  {
    id: id(),
    workspaceId: ref("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    userId: varchar("user_id", { length: 40 })
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: mysqlEnum("role", ROLES).notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("memberships_ws_user_uq").on(t.workspaceId, t.userId)],
);

/** A write-ahead of every e-mail: sent by the mailer, kept when the SMTP server is down. */
export const outbox = mysqlTable(
  "outbox",
  {
    id: id(),
    toAddress: varchar("to_address", { length: 254 }).notNull(),
    subject: varchar("subject", { length: 200 }).notNull(),
    textBody: text("text_body").notNull(),
    htmlBody: text("html_body").notNull(),
    attempts: int("attempts").notNull().default(0),
    lastError: varchar("last_error", { length: 500 }),
    sentAt: datetime("sent_at", { mode: "date", fsp: 3 }),
    createdAt: createdAt(),
  },
  (t) => [index("outbox_unsent_idx").on(t.sentAt)],
);

/** Single-use, expiring e-mail links (address verification, password reset); only the hash is kept. */
export const emailTokens = mysqlTable(
  "email_tokens",
  {
    id: id(),
    userId: varchar("user_id", { length: 40 })
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    purpose: mysqlEnum("purpose", ["verify", "reset"]).notNull(),
    tokenHash: varchar("token_hash", { length: 64 }).notNull(),
    expiresAt: datetime("expires_at", { mode: "date" }).notNull(),
    usedAt: datetime("used_at", { mode: "date" }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("email_tokens_hash_uq").on(t.tokenHash), index("email_tokens_user_idx").on(t.userId)],
);

/** Sign-in attempts, for throttling per account and per address (kept in the database: shared by every app process). */
export const signInAttempts = mysqlTable(
  "sign_in_attempts",
  {
    id: id(),
    emailKey: varchar("email_key", { length: 254 }).notNull(),
    ipAddress: varchar("ip_address", { length: 64 }).notNull(),
    success: boolean("success").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("sign_in_attempts_email_idx").on(t.emailKey, t.createdAt), index("sign_in_attempts_ip_idx").on(t.ipAddress, t.createdAt)],
);

export const invitations = mysqlTable(
  "invitations",
  {
    id: id(),
    workspaceId: ref("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    email: varchar("email", { length: 254 }).notNull(),
    role: mysqlEnum("role", ROLES).notNull(),
    tokenHash: varchar("token_hash", { length: 64 }).notNull(),
    invitedBy: varchar("invited_by", { length: 40 }).references(() => users.id, { onDelete: "set null" }),
    expiresAt: datetime("expires_at", { mode: "date" }).notNull(),
    acceptedAt: datetime("accepted_at", { mode: "date" }),
    revokedAt: datetime("revoked_at", { mode: "date" }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("invitations_hash_uq").on(t.tokenHash), index("invitations_ws_idx").on(t.workspaceId)],
);

export const apiTokens = mysqlTable(
  "api_tokens",
  {
    id: id(),
    userId: varchar("user_id", { length: 40 })
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    workspaceId: ref("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 80 }).notNull(),
    prefix: varchar("prefix", { length: 16 }).notNull(),
    tokenHash: varchar("token_hash", { length: 64 }).notNull(),
    scope: mysqlEnum("scope", ["read", "write"]).notNull(),
    lastUsedAt: datetime("last_used_at", { mode: "date" }),
    revokedAt: datetime("revoked_at", { mode: "date" }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("api_tokens_hash_uq").on(t.tokenHash), index("api_tokens_user_idx").on(t.userId)],
);

// ── Pump libraries (issue: vendor CSV import) ───────────────────────────────────────────────
// A library belongs to a workspace; every import makes a new immutable revision holding its own
// models, curve sets and points, so selections keep the revision they were made with.

export const libraries = mysqlTable(
  "libraries",
  {
    id: id(),
    workspaceId: ref("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 120 }).notNull(),
    description: varchar("description", { length: 1000 }).notNull().default(""),
    visibility: mysqlEnum("visibility", VISIBILITIES).notNull().default("private"),
    currentRevisionId: ref("current_revision_id"),
    mappingJson: text("mapping_json"),
    /** Set instead of deleting when selections still refer to the library's curves. */
    archivedAt: datetime("archived_at", { mode: "date" }),
    createdBy: varchar("created_by", { length: 40 }).references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("libraries_ws_idx").on(t.workspaceId), index("libraries_visibility_idx").on(t.visibility)],
);

/** The original uploaded file, byte for byte, with its SHA-256. */
export const uploads = mysqlTable(
  "uploads",
  {
    id: id(),
    libraryId: ref("library_id")
      .notNull()
      .references(() => libraries.id, { onDelete: "cascade" }),
    filename: varchar("filename", { length: 255 }).notNull(),
    sizeBytes: int("size_bytes").notNull(),
    sha256: varchar("sha256", { length: 64 }).notNull(),
    content: longblob("content").notNull(),
    // Set when the CSV was produced by the curve tracer (issue 20): "traced from <file>, page N".
    source: varchar("source", { length: 300 }),
    tracePictureId: ref("trace_picture_id").references(() => tracePictures.id, { onDelete: "set null" }),
    createdBy: varchar("created_by", { length: 40 }).references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("uploads_library_idx").on(t.libraryId)],
);

/** A datasheet picture (PDF, PNG or JPEG) kept as uploaded, with its checksum, for the curve tracer. */
export const tracePictures = mysqlTable(
  "trace_pictures",
  {
    id: id(),
    libraryId: ref("library_id")
      .notNull()
      .references(() => libraries.id, { onDelete: "cascade" }),
    filename: varchar("filename", { length: 255 }).notNull(),
    contentType: varchar("content_type", { length: 60 }).notNull(),
    sizeBytes: int("size_bytes").notNull(),
    sha256: varchar("sha256", { length: 64 }).notNull(),
    content: longblob("content").notNull(),
    createdBy: varchar("created_by", { length: 40 }).references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("trace_pictures_library_idx").on(t.libraryId)],
);

export const libraryRevisions = mysqlTable(
  "library_revisions",
  {
    id: id(),
    libraryId: ref("library_id")
      .notNull()
      .references(() => libraries.id, { onDelete: "cascade" }),
    number: int("number").notNull(),
    uploadId: ref("upload_id").references(() => uploads.id, { onDelete: "set null" }),
    note: varchar("note", { length: 500 }).notNull().default(""),
    modelCount: int("model_count").notNull().default(0),
    curveCount: int("curve_count").notNull().default(0),
    pointCount: int("point_count").notNull().default(0),
    skippedCount: int("skipped_count").notNull().default(0),
    createdBy: varchar("created_by", { length: 40 }).references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("library_revisions_num_uq").on(t.libraryId, t.number)],
);

/**
 * One import of an upload into a new revision, and how far it got: written outside the import's own
 * transaction (so other requests see it while it runs); `points_written` advances per batch streamed
 * to the server. status: running | done | failed. A running row whose updated_at stops moving belongs
 * to an import whose process went away (its transaction was rolled back with it).
 */
export const imports = mysqlTable(
  "imports",
  {
    id: id(),
    libraryId: ref("library_id")
      .notNull()
      .references(() => libraries.id, { onDelete: "cascade" }),
    uploadId: ref("upload_id").references(() => uploads.id, { onDelete: "set null" }),
    status: varchar("status", { length: 12 }).notNull().default("running"),
    pointsTotal: int("points_total").notNull().default(0),
    pointsWritten: int("points_written").notNull().default(0),
    revisionId: ref("revision_id").references(() => libraryRevisions.id, { onDelete: "set null" }),
    revisionNumber: int("revision_number"),
    message: varchar("message", { length: 500 }).notNull().default(""),
    createdBy: varchar("created_by", { length: 40 }).references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: datetime("updated_at", { mode: "date", fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [index("imports_library_idx").on(t.libraryId, t.id)],
);

export const pumpModels = mysqlTable(
  "pump_models",
  {
    id: id(),
    revisionId: ref("revision_id")
      .notNull()
      .references(() => libraryRevisions.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 160 }).notNull(),
    type: varchar("type", { length: 80 }).notNull().default(""),
    nominalSize: varchar("nominal_size", { length: 60 }).notNull().default(""),
    ratedSpeed: double("rated_speed"),
    impellerMin: double("impeller_min"),
    impellerMax: double("impeller_max"),
    notes: varchar("notes", { length: 1000 }).notNull().default(""),
  },
  (t) => [index("pump_models_rev_idx").on(t.revisionId)],
);

/** One curve (one speed and impeller diameter); summary columns pre-filter the duty-point search. */
export const curveSets = mysqlTable(
  "curve_sets",
  {
    id: id(),
    modelId: ref("model_id")
      .notNull()
      .references(() => pumpModels.id, { onDelete: "cascade" }),
    revisionId: ref("revision_id")
      .notNull()
      .references(() => libraryRevisions.id, { onDelete: "cascade" }),
    speed: double("speed"), // rpm
    impellerDiameter: double("impeller_diameter"), // m
    flowMin: double("flow_min").notNull(), // m³/s
    flowMax: double("flow_max").notNull(),
    headMax: double("head_max").notNull(), // m
    headMin: double("head_min").notNull(),
    pointCount: int("point_count").notNull(),
    minFlow: double("min_flow"), // m³/s: the maker's minimum continuous flow, null when the upload gave none
  },
  (t) => [index("curve_sets_rev_idx").on(t.revisionId), index("curve_sets_model_idx").on(t.modelId)],
);

export const curvePoints = mysqlTable(
  "curve_points",
  {
    id: id(),
    curveSetId: ref("curve_set_id")
      .notNull()
      .references(() => curveSets.id, { onDelete: "cascade" }),
    seq: int("seq").notNull(),
    flow: double("flow").notNull(), // m³/s
    head: double("head").notNull(), // m
    efficiency: double("efficiency"), // 0..1
    power: double("power"), // W (shaft)
    npshr: double("npshr"), // m
  },
  (t) => [index("curve_points_set_idx").on(t.curveSetId, t.seq)],
);

// ── Engineer's workspace: projects, systems, candidates, selections ────────────────────────
export const projects = mysqlTable(
  "projects",
  {
    id: id(),
    workspaceId: ref("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 160 }).notNull(),
    site: varchar("site", { length: 200 }).notNull().default(""),
    description: varchar("description", { length: 2000 }).notNull().default(""),
    archivedAt: datetime("archived_at", { mode: "date" }),
    createdBy: varchar("created_by", { length: 40 }).references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("projects_ws_idx").on(t.workspaceId)],
);

/** One pumped circuit; its inputs are one JSON document validated by SystemInputSchema (app/lib/projects/system-input.ts), SI units. */
export const systems = mysqlTable(
  "systems",
  {
    id: id(),
    projectId: ref("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    workspaceId: ref("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 160 }).notNull(),
    inputJson: text("input_json").notNull(),
    archivedAt: datetime("archived_at", { mode: "date" }),
    createdAt: createdAt(),
    updatedAt: datetime("updated_at", { mode: "date", fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [index("systems_project_idx").on(t.projectId), index("systems_ws_idx").on(t.workspaceId)],
);

/** A pump curve set overlaid on a system, with how it is adjusted (speed, trim, several pumps). */
export const candidates = mysqlTable(
  "candidates",
  {
    id: id(),
    systemId: ref("system_id")
      .notNull()
      .references(() => systems.id, { onDelete: "cascade" }),
    curveSetId: ref("curve_set_id")
      .notNull()
      .references(() => curveSets.id, { onDelete: "cascade" }),
    adjustmentJson: text("adjustment_json").notNull(),
    /** Purchase price for the life-cycle cost, integer cents of the workspace's currency; null: not given. */
    purchasePriceCents: bigint("purchase_price_cents", { mode: "number", unsigned: true }),
    createdAt: createdAt(),
  },
  (t) => [index("candidates_system_idx").on(t.systemId)],
);

/** The chosen candidate, frozen: inputs, curve points, library revision and results as JSON. */
export const selections = mysqlTable(
  "selections",
  {
    id: id(),
    systemId: ref("system_id")
      .notNull()
      .references(() => systems.id, { onDelete: "cascade" }),
    projectId: ref("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    workspaceId: ref("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    curveSetId: ref("curve_set_id"),
    revisionId: ref("revision_id"),
    title: varchar("title", { length: 200 }).notNull(),
    note: varchar("note", { length: 2000 }).notNull().default(""),
    frozenJson: mediumtext("frozen_json").notNull(),
    createdBy: varchar("created_by", { length: 40 }).references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("selections_system_idx").on(t.systemId), index("selections_ws_idx").on(t.workspaceId)],
);

/** Fixed-window request counters per key (e.g. "calc:127.0.0.1"), shared by every app process. */
export const rateLimits = mysqlTable(
  "rate_limits",
  {
    bucket: varchar("bucket", { length: 120 }).notNull(),
    windowStart: datetime("window_start", { mode: "date" }).notNull(),
    hits: int("hits").notNull().default(0),
  },
  (t) => [primaryKey({ name: "rate_limits_pk", columns: [t.bucket, t.windowStart] })],
);

// ── Billing ─────────────────────────────────────────────────────────────────────────────────
/**
 * Every Stripe event handled, by id: a replayed event is recognised and changes nothing. An event naming a
 * subscription keeps its id; a subscription event also the status it states (deleted: canceled), so that
 * events of one subscription are ordered among themselves (billing/webhook.server.ts).
 */
export const stripeEvents = mysqlTable(
  "stripe_events",
  {
    id: varchar("id", { length: 80 }).primaryKey(),
    type: varchar("type", { length: 80 }).notNull(),
    workspaceId: ref("workspace_id"),
    eventCreatedAt: datetime("event_created_at", { mode: "date" }).notNull(),
    subscriptionId: varchar("subscription_id", { length: 80 }),
    subscriptionStatus: varchar("subscription_status", { length: 32 }),
    processedAt: createdAt(),
  },
  (t) => [index("stripe_events_subscription_idx").on(t.workspaceId, t.subscriptionId)],
);

// ── Field checks ────────────────────────────────────────────────────────────────────────────
/** A project shared with another workspace (e.g. the contractor commissioning it). */
export const projectShares = mysqlTable(
  "project_shares",
  {
    id: id(),
    projectId: ref("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    workspaceId: ref("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    createdBy: varchar("created_by", { length: 40 }).references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    /** Only an accepted share opens the project's selections to the workspace (migration 0013: rows before it were accepted). */
    state: mysqlEnum("state", SHARE_STATES).notNull().default("pending"),
    /** The receiving workspace's admin who accepted or declined, and when; null while pending (and on shares from before consent). */
    decidedBy: varchar("decided_by", { length: 40 }).references(() => users.id, { onDelete: "set null" }),
    decidedAt: datetime("decided_at", { mode: "date", fsp: 3 }),
  },
  (t) => [uniqueIndex("project_shares_uq").on(t.projectId, t.workspaceId)],
);

export const VERDICTS = ["pass", "marginal", "fail", "unknown"] as const;

/** Site readings against a selection. Never edited: an amendment is a new version of the same chain. */
export const fieldChecks = mysqlTable(
  "field_checks",
  {
    id: id(),
    selectionId: ref("selection_id")
      .notNull()
      .references(() => selections.id, { onDelete: "cascade" }),
    /** Id of the first version of this check (itself for version 1). */
    chainId: ref("chain_id"),
    version: int("version").notNull().default(1),
    workspaceId: ref("workspace_id")
      .notNull()
      .references(() => workspaces.id, { onDelete: "cascade" }),
    createdBy: varchar("created_by", { length: 40 }).references(() => users.id, { onDelete: "set null" }),
    readingsJson: mediumtext("readings_json").notNull(),
    resultJson: mediumtext("result_json").notNull(),
    verdict: mysqlEnum("verdict", VERDICTS).notNull(),
    grade: varchar("grade", { length: 20 }).notNull(),
    notes: text("notes").notNull(),
    /** Id made on the device that recorded the check (offline sync): the server accepts it once. Null for checks from before. */
    clientId: varchar("client_id", { length: 64 }),
    /** The phone's clock when the readings were taken (kept on it offline, sent later); null from the page's own form and for checks from before. */
    takenAt: datetime("taken_at", { mode: "date", fsp: 3 }),
    /** The server's clock when the check was recorded. */
    createdAt: createdAt(),
  },
  (t) => [index("field_checks_selection_idx").on(t.selectionId), index("field_checks_chain_idx").on(t.chainId), uniqueIndex("field_checks_client_uq").on(t.clientId)],
);

export const fieldCheckPhotos = mysqlTable(
  "field_check_photos",
  {
    id: id(),
    fieldCheckId: ref("field_check_id")
      .notNull()
      .references(() => fieldChecks.id, { onDelete: "cascade" }),
    filename: varchar("filename", { length: 255 }).notNull(),
    contentType: varchar("content_type", { length: 60 }).notNull(),
    sizeBytes: int("size_bytes").notNull(),
    sha256: varchar("sha256", { length: 64 }).notNull(),
    content: longblob("content").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("field_check_photos_check_idx").on(t.fieldCheckId)],
);
