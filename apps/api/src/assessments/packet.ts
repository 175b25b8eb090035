import { createHash } from 'node:crypto';
import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import {
  buildSafetyPacket,
  documentStatusEntries,
  packetHashContent,
  safetyNotesSchema,
  todayIso,
  type AssessmentStatus,
  type DocumentKind,
  type ExposureInput,
  type PacketDocument,
  type PacketMissingDocument,
  type PartB,
  type SafetyPacket,
  type SafetyPacketLineInput,
  type SubstanceInput,
} from '@batchproof/shared';
import { notFound } from '../core/app-error';
import type { Database } from '../db/database';
import {
  batches,
  complaints,
  documents,
  formulas,
  formulaVersions,
  safetyNotes,
  workshops,
} from '../db/schema';
import { documentInUse } from '../documents/documents-repository';
import { evaluateLines, gramLines } from '../formulas/formula-evaluation';
import { findLines } from '../formulas/formulas-repository';
import { renderDocumentPdf } from '../labels/pdf';
import { findProductIdentity } from '../labels/product-identity-repository';
import { findMaterials, type MaterialRow } from '../materials/materials-repository';
import { packetDocument } from './packet-pdf';

/**
 * The safety-assessment packet of one formula version (Annex I Part A/B of Regulation (EC)
 * No 1223/2009): gathered from the database here, laid out by the shared `buildSafetyPacket`,
 * hashed (SHA-256 of `packetHashContent`) and drawn as a PDF by the label PDF worker.
 */

/** What the packet needs of the stored assessment. */
export interface AssessmentForPacket {
  id: string;
  versionId: string;
  status: AssessmentStatus;
  assessorName: string;
  exposure: ExposureInput | null;
  substances: SubstanceInput[];
  partB: PartB;
  signedAt: Date | null;
  signedByName: string | null;
  contentHash: string | null;
}

/** What each kind of supplier document is called in the packet. */
const DOCUMENT_KIND_WORDS: Readonly<Record<DocumentKind, string>> = {
  sds: 'Safety data sheet',
  'certificate-of-analysis': 'Certificate of analysis',
  'ifra-certificate': 'IFRA certificate',
  'allergen-declaration': 'Allergen declaration',
  specification: 'Specification',
  other: 'Other document',
};

async function findVersionWithFormula(db: Database, workshopId: string, versionId: string) {
  const [row] = await db
    .select({
      version: formulaVersions,
      formula: { id: formulas.id, name: formulas.name, productType: formulas.productType },
    })
    .from(formulaVersions)
    .innerJoin(
      formulas,
      and(
        eq(formulas.workshopId, formulaVersions.workshopId),
        eq(formulas.id, formulaVersions.formulaId),
      ),
    )
    .where(and(eq(formulaVersions.workshopId, workshopId), eq(formulaVersions.id, versionId)));
  return row;
}

/** Documents in use (not archived, not replaced) of the materials, newest issue first. */
async function materialDocuments(db: Database, workshopId: string, materialIds: string[]) {
  if (materialIds.length === 0) return [];
  return db
    .select({
      materialId: documents.materialId,
      kind: documents.kind,
      title: documents.title,
      issuedOn: documents.issuedOn,
    })
    .from(documents)
    .where(
      and(
        eq(documents.workshopId, workshopId),
        inArray(documents.materialId, materialIds),
        documentInUse(),
      ),
    )
    .orderBy(desc(documents.issuedOn), desc(documents.createdAt), asc(documents.title));
}

type DocRow = Awaited<ReturnType<typeof materialDocuments>>[number];

/**
 * Documents on file per material (in formula order) and those missing: the kinds a material of
 * its category should have (`documentStatusEntries`: a safety data sheet always, an IFRA
 * certificate and an allergen declaration for fragrances and essential oils).
 */
function documentsOf(materials: MaterialRow[], docs: DocRow[], today: string) {
  const onFile: PacketDocument[] = [];
  const missing: PacketMissingDocument[] = [];
  for (const m of materials) {
    const own = docs.filter((d) => d.materialId === m.id);
    for (const d of own) {
      onFile.push({
        materialName: m.tradeName,
        kind: DOCUMENT_KIND_WORDS[d.kind],
        title: d.title,
        issuedOn: d.issuedOn,
        expiresOn: null,
      });
    }
    for (const entry of documentStatusEntries(m.category, own, today)) {
      if (entry.state === 'missing')
        missing.push({ materialName: m.tradeName, what: DOCUMENT_KIND_WORDS[entry.kind] });
    }
  }
  return { onFile, missing };
}

async function complaintsOf(db: Database, workshopId: string, formulaId: string) {
  return db
    .select({
      receivedOn: complaints.receivedOn,
      whatHappened: complaints.whatHappened,
      bodyArea: complaints.bodyArea,
      serious: complaints.serious,
      batchCode: sql<string | null>`coalesce(${batches.batchCode}, ${complaints.finishedLotCode})`,
      status: complaints.status,
    })
    .from(complaints)
    .leftJoin(
      batches,
      and(eq(batches.workshopId, complaints.workshopId), eq(batches.id, complaints.batchId)),
    )
    .where(and(eq(complaints.workshopId, workshopId), eq(complaints.formulaId, formulaId)))
    .orderBy(desc(complaints.receivedOn), desc(complaints.createdAt), asc(complaints.id));
}

async function batchesOf(db: Database, workshopId: string, versionId: string) {
  return db
    .select({
      code: batches.batchCode,
      madeOn: batches.madeOn,
      unitsMade: batches.unitsMade,
      status: batches.state,
    })
    .from(batches)
    .where(and(eq(batches.workshopId, workshopId), eq(batches.versionId, versionId)))
    .orderBy(asc(batches.madeOn), asc(batches.batchCode));
}

async function notesOf(db: Database, workshopId: string, versionId: string) {
  const [row] = await db
    .select({ notes: safetyNotes.notes })
    .from(safetyNotes)
    .where(and(eq(safetyNotes.workshopId, workshopId), eq(safetyNotes.versionId, versionId)));
  return safetyNotesSchema.parse(row?.notes ?? {});
}

async function workshopOf(db: Database, workshopId: string) {
  const [row] = await db
    .select({ name: workshops.name, address: workshops.address })
    .from(workshops)
    .where(eq(workshops.id, workshopId));
  return row ?? { name: '', address: null };
}

/**
 * Gathers everything the packet of the assessment's formula version shows, from the caller's
 * workshop only: the version and its lines with their materials, the stored evaluation (or a
 * fresh one when none is stored), the maker's safety notes, complaints about the formula, the
 * materials' documents, the version's batches and the assessor's inputs.
 */
export async function loadSafetyPacket(
  db: Database,
  workshopId: string,
  a: AssessmentForPacket,
  now: Date = new Date(),
): Promise<SafetyPacket> {
  const found = await findVersionWithFormula(db, workshopId, a.versionId);
  if (!found) throw notFound('That formula version');
  const { version, formula } = found;
  const lines = await findLines(db, workshopId, version.id);
  const materialIds = [...new Set(lines.map((l) => l.materialId))];
  // One after another: `db` may be a transaction, whose single client must not run queries
  // concurrently (node-postgres warns now and will refuse in its next major version).
  const materialRows = await findMaterials(db, workshopId, materialIds);
  const docs = await materialDocuments(db, workshopId, materialIds);
  const complaintRows = await complaintsOf(db, workshopId, formula.id);
  const batchRows = await batchesOf(db, workshopId, version.id);
  const notes = await notesOf(db, workshopId, version.id);
  const workshop = await workshopOf(db, workshopId);
  const identity = await findProductIdentity(db, workshopId, formula.id);
  const byId = new Map(materialRows.map((m) => [m.id, m]));
  const evaluation =
    version.evaluation ??
    (
      await evaluateLines(
        db,
        workshopId,
        { name: formula.name, productType: formula.productType },
        gramLines(lines),
        version.profile,
        now,
      )
    ).evaluation;
  const packetLines: SafetyPacketLineInput[] = lines.map((l, index) => {
    const material = byId.get(l.materialId)!;
    const certificate = docs.find(
      (d) => d.materialId === material.id && d.kind === 'ifra-certificate',
    );
    return {
      position: index + 1,
      grams: l.grams,
      material,
      certificate: certificate
        ? { title: certificate.title, issuedOn: certificate.issuedOn }
        : null,
    };
  });
  const ordered = materialIds.map((id) => byId.get(id)!);
  const { onFile, missing } = documentsOf(ordered, docs, todayIso(now));
  return buildSafetyPacket({
    formula: { id: formula.id, name: formula.name, productType: formula.productType },
    version: {
      id: version.id,
      number: version.number,
      state: version.state,
      releasedAt: version.releasedAt?.toISOString() ?? null,
    },
    workshop,
    lines: packetLines,
    evaluation,
    identity: identity?.identity ?? null,
    notes,
    complaints: complaintRows,
    documentsOnFile: onFile,
    documentsMissing: missing,
    batches: batchRows,
    assessment: {
      id: a.id,
      status: a.status,
      assessorName: a.assessorName,
      exposure: a.exposure,
      substances: a.substances,
      partB: a.partB,
      signedAt: a.signedAt?.toISOString() ?? null,
      signedByName: a.signedByName,
      contentHash: a.contentHash,
    },
    generatedAt: now.toISOString(),
  });
}

/** SHA-256 hex of the packet's canonical content (without generatedAt and the signature). */
export function packetHash(packet: SafetyPacket): string {
  return createHash('sha256').update(packetHashContent(packet), 'utf8').digest('hex');
}

/**
 * The packet as a PDF (A4, Source Sans 3, drawn by the label PDF worker); `draft` marks every
 * page "DRAFT – NOT SIGNED".
 */
export async function renderPacketPdf(
  packet: SafetyPacket,
  opts: { draft: boolean },
): Promise<Buffer> {
  return renderDocumentPdf(packetDocument(packet, { draft: opts.draft, hash: packetHash(packet) }));
}
