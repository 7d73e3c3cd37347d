import { and, asc, desc, eq, inArray, max, sql } from "drizzle-orm";
import type { Db } from "../db/client.js";
import { people } from "../db/schema.js";
import { recordAudit } from "./audit.js";
import { confirmSigner, recordSignature, signaturesFor } from "./signatureRecorder.js";
import type { CheckCredentials } from "./credentialChecker.js";
import type { SignedInPerson } from "../policies/access.js";
import { conflict, HttpError, notFound } from "../http/errors.js";
import type { SignatureView, VersionStatus } from "../../shared/schemas/common.js";

/* eslint-disable @typescript-eslint/no-explicit-any */
type AnyTable = any;

export interface VersionRow {
  id: string;
  version: number;
  status: VersionStatus;
  content: unknown;
  revision: number;
  createdBy: string;
  createdAt: Date;
  approvedAt: Date | null;
  [column: string]: unknown;
}

export interface FamilyRow {
  id: string;
  code: string;
  title: string;
}

/** How one kind of versioned document (rate model, master record) is stored. */
export interface VersionedKind<Content> {
  entityType: string;
  what: string;
  families: AnyTable;
  versions: AnyTable;
  /** The versions table's column pointing at its family. */
  familyColumn: string;
  /** Extra columns derived from the content (e.g. εA); throws HttpError on bad content. */
  derive(content: Content): Record<string, unknown>;
}

export interface VersionView<Content> {
  id: string;
  familyId: string;
  code: string;
  title: string;
  version: number;
  status: VersionStatus;
  content: Content;
  row: VersionRow;
  createdBy: { id: string; name: string };
  createdAt: string;
  approvedAt: string | null;
  revision: number;
  signatures: SignatureView[];
  abilities: { edit: boolean; approve: boolean; succeed: boolean };
}

/** Exactly what an approval signs: the version's identity and content. */
const signedContent = (family: FamilyRow, v: VersionRow) => ({ code: family.code, version: v.version, content: v.content });

/**
 * The draft → approved → superseded lifecycle shared by rate models and master records.
 * Engineers draft; quality approves with a password signature; nobody approves their own draft;
 * approving a version supersedes the one approved before; only drafts change.
 */
export function createVersionedDocuments<Content>(db: Db, check: CheckCredentials, kind: VersionedKind<Content>) {
  const V = kind.versions;
  const F = kind.families;
  const familyOf = V[kind.familyColumn];

  async function present(rows: VersionRow[], viewer: SignedInPerson): Promise<VersionView<Content>[]> {
    if (rows.length === 0) return [];
    const familyIds = [...new Set(rows.map((r) => r[kind.familyColumn] as string))];
    const fams = (await db.select().from(F).where(inArray(F.id, familyIds))) as FamilyRow[];
    const famById = new Map(fams.map((f) => [f.id, f]));
    const authors = await db.select({ id: people.id, name: people.name }).from(people).where(inArray(people.id, [...new Set(rows.map((r) => r.createdBy))]));
    const nameOf = new Map(authors.map((a) => [a.id, a.name]));
    const drafts = await db.select({ family: familyOf }).from(V).where(and(inArray(familyOf, familyIds), eq(V.status, "draft")));
    const hasDraft = new Set(drafts.map((d: { family: string }) => d.family));
    const sigs = await signaturesFor(db, kind.entityType, new Map(rows.map((r) => [r.id, signedContent(famById.get(r[kind.familyColumn] as string)!, r)])));
    const isEngineer = viewer.roles.includes("engineer");
    return rows.map((r) => {
      const fam = famById.get(r[kind.familyColumn] as string)!;
      return {
        id: r.id,
        familyId: fam.id,
        code: fam.code,
        title: fam.title,
        version: r.version,
        status: r.status,
        content: r.content as Content,
        row: r,
        createdBy: { id: r.createdBy, name: nameOf.get(r.createdBy) ?? "unknown" },
        createdAt: r.createdAt.toISOString(),
        approvedAt: r.approvedAt?.toISOString() ?? null,
        revision: r.revision,
        signatures: sigs.get(r.id) ?? [],
        abilities: {
          edit: r.status === "draft" && isEngineer,
          approve: r.status === "draft" && viewer.roles.includes("quality") && r.createdBy !== viewer.id,
          succeed: r.status === "approved" && isEngineer && !hasDraft.has(fam.id),
        },
      };
    });
  }

  async function loadVersion(id: string): Promise<VersionRow> {
    const [row] = (await db.select().from(V).where(eq(V.id, id))) as VersionRow[];
    if (!row) throw notFound(`That ${kind.what} version`);
    return row;
  }

  return {
    present,
    async list(viewer: SignedInPerson) {
      const rows = (await db.select().from(V).orderBy(asc(familyOf), desc(V.version))) as VersionRow[];
      return present(rows, viewer);
    },
    async get(id: string, viewer: SignedInPerson) {
      return (await present([await loadVersion(id)], viewer))[0];
    },
    async versionsOf(familyId: string, viewer: SignedInPerson) {
      const rows = (await db.select().from(V).where(eq(familyOf, familyId)).orderBy(desc(V.version))) as VersionRow[];
      if (rows.length === 0) throw notFound(`That ${kind.what}`);
      return present(rows, viewer);
    },

    async createFamily(actor: SignedInPerson, input: { code: string; title: string; content: Content }) {
      const derived = kind.derive(input.content);
      const id = await db.transaction(async (tx) => {
        const [fam] = (await tx.insert(F).values({ code: input.code, title: input.title, createdBy: actor.id }).onConflictDoNothing().returning()) as FamilyRow[];
        if (!fam) throw conflict("code-taken", `A ${kind.what} with the code ${input.code} exists already; add a new version to it instead.`);
        const [v] = (await tx.insert(V).values({ [kind.familyColumn]: fam.id, version: 1, content: input.content, createdBy: actor.id, ...derived }).returning()) as VersionRow[];
        await recordAudit(tx, actor, { action: `${kind.entityType}-created`, entityType: kind.entityType, entityId: v.id, after: { code: fam.code, title: fam.title, version: 1, status: "draft", content: input.content, ...derived } });
        return v.id as string;
      });
      return (await present([await loadVersion(id)], actor))[0];
    },

    async createDraft(actor: SignedInPerson, familyId: string, content: Content, extra: Record<string, unknown> = {}) {
      const derived = kind.derive(content);
      const id = await db.transaction(async (tx) => {
        const [fam] = await tx.select().from(F).where(eq(F.id, familyId)).for("update");
        if (!fam) throw notFound(`That ${kind.what}`);
        const [open] = await tx.select({ id: V.id, version: V.version }).from(V).where(and(eq(familyOf, familyId), eq(V.status, "draft")));
        if (open) throw conflict("draft-exists", `Version ${open.version} of ${fam.code} is still a draft: edit it, or have it approved, before starting another.`, { draftId: open.id });
        const [{ latest }] = await tx.select({ latest: max(V.version) }).from(V).where(eq(familyOf, familyId));
        const version = Number(latest ?? 0) + 1;
        const [v] = (await tx.insert(V).values({ [kind.familyColumn]: familyId, version, content, createdBy: actor.id, ...derived, ...extra }).returning()) as VersionRow[];
        await recordAudit(tx, actor, { action: `${kind.entityType}-drafted`, entityType: kind.entityType, entityId: v.id, after: { code: fam.code, version, status: "draft", content, ...derived, ...extra } });
        return v.id as string;
      });
      return (await present([await loadVersion(id)], actor))[0];
    },

    async updateDraft(actor: SignedInPerson, id: string, content: Content, reason: string, revision: number) {
      const derived = kind.derive(content);
      await db.transaction(async (tx) => {
        const [row] = await tx.select().from(V).where(eq(V.id, id)).for("update");
        if (!row) throw notFound(`That ${kind.what} version`);
        if (row.status !== "draft") throw conflict("not-a-draft", `Version ${row.version} is ${row.status}: approved versions are never edited. Start a new version instead.`);
        if (row.revision !== revision) throw conflict("stale-revision", "Someone changed this draft since you opened it. Reload it and make your change again.", { currentRevision: row.revision });
        await tx.update(V).set({ content, ...derived, revision: row.revision + 1, updatedAt: sql`now()` }).where(eq(V.id, id));
        await recordAudit(tx, actor, { action: `${kind.entityType}-draft-changed`, entityType: kind.entityType, entityId: id, before: { content: row.content, revision: row.revision }, after: { content, ...derived, revision: row.revision + 1 }, reason });
      });
      return (await present([await loadVersion(id)], actor))[0];
    },

    async approve(actor: SignedInPerson, id: string, password: string, comment?: string) {
      const current = await loadVersion(id);
      if (current.status !== "draft") throw conflict("not-a-draft", `Version ${current.version} is already ${current.status}.`);
      if (current.createdBy === actor.id) throw new HttpError(403, "own-draft", "You drafted this version, so someone else in quality must approve it.");
      await confirmSigner(check, actor, password);
      await db.transaction(async (tx) => {
        const [row] = await tx.select().from(V).where(eq(V.id, id)).for("update");
        if (row.status !== "draft") throw conflict("not-a-draft", `Version ${row.version} was ${row.status} by someone else a moment ago.`);
        const [fam] = (await tx.select().from(F).where(eq(F.id, row[kind.familyColumn]))) as FamilyRow[];
        const previous = (await tx.select().from(V).where(and(eq(familyOf, fam.id), eq(V.status, "approved"))).for("update")) as VersionRow[];
        for (const p of previous) {
          await tx.update(V).set({ status: "superseded", updatedAt: sql`now()` }).where(eq(V.id, p.id));
          await recordAudit(tx, actor, { action: `${kind.entityType}-superseded`, entityType: kind.entityType, entityId: p.id, before: { status: "approved" }, after: { status: "superseded", supersededBy: row.id }, reason: `version ${row.version} approved` });
        }
        const [approved] = (await tx.update(V).set({ status: "approved", approvedAt: sql`now()`, updatedAt: sql`now()` }).where(eq(V.id, id)).returning()) as VersionRow[];
        await recordSignature(tx, actor, { meaning: "approved", entityType: kind.entityType, entityId: id, content: signedContent(fam, approved), comment });
        await recordAudit(tx, actor, { action: `${kind.entityType}-approved`, entityType: kind.entityType, entityId: id, before: { status: "draft" }, after: { status: "approved" }, reason: comment || "approved with electronic signature" });
      });
      return (await present([await loadVersion(id)], actor))[0];
    },
  };
}

export type VersionedDocuments<C> = ReturnType<typeof createVersionedDocuments<C>>;
