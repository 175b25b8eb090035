import type { z } from 'zod';
import {
  formulaVersionInputSchema,
  linesInGrams,
  type ComplianceFinding,
  type FormulaVersion,
  type FormulaVersionFields,
} from '@batchproof/shared';
import type { formulaCreateSchema, formulaUpdateSchema, releaseSchema } from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { AppError, conflict, forbidden, notFound } from '../core/app-error';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import { deleteLogged } from '../housekeeping/deletion';
import { evaluateLines, gramLines } from './formula-evaluation';
import { getFormula, versionView } from './formula-views';
import * as repo from './formulas-repository';

const immutable = (n: number, state: string) =>
  conflict(
    `Version ${n} is ${state} and can no longer change. Start a new draft from it to make changes.`,
  );

/**
 * Creates a formula with its first draft, evaluated by the shared engine. The read-back shares
 * the inserts' transaction, so a failure there leaves no formula behind an error.
 */
export async function createFormula(
  db: Database,
  actor: AuthUser,
  input: z.output<typeof formulaCreateSchema>,
) {
  const lines = linesInGrams(input.draft);
  const evaluation = await evaluateLines(db, actor.workshopId, input, lines, input.draft.profile);
  return db.transaction(async (tx) => {
    const formulaId = await repo.insertFormula(tx, actor.workshopId, {
      name: input.name,
      productType: input.productType,
      notes: input.notes,
    });
    const versionId = await repo.insertVersion(tx, {
      workshopId: actor.workshopId,
      formulaId,
      number: 1,
      profile: input.draft.profile,
      notes: input.draft.notes,
      ...evaluation,
    });
    await repo.replaceLines(tx, actor.workshopId, versionId, lines);
    await recordAudit(tx, actor, {
      action: 'formula.created',
      subjectType: 'formula',
      subjectId: formulaId,
      detail: { name: input.name, lines: lines.length },
    });
    return getFormula(tx, actor, formulaId);
  });
}

export async function updateFormula(
  db: Database,
  actor: AuthUser,
  id: string,
  input: z.output<typeof formulaUpdateSchema>,
) {
  return db.transaction(async (tx) => {
    if (!(await repo.updateFormula(tx, actor.workshopId, id, input)))
      throw notFound('That formula');
    await recordAudit(tx, actor, {
      action: 'formula.changed',
      subjectType: 'formula',
      subjectId: id,
      detail: { ...input },
    });
    return getFormula(tx, actor, id);
  });
}

/**
 * Saves a draft's content and re-evaluates it on the server. The version row is locked first,
 * so a release racing this save sees either the old or the new content, never half of each.
 */
export async function saveDraft(
  db: Database,
  actor: AuthUser,
  formulaId: string,
  n: number,
  input: FormulaVersionFields,
) {
  const formula = await repo.findFormula(db, actor.workshopId, formulaId);
  if (!formula) throw notFound('That formula');
  const lines = linesInGrams(input);
  const evaluation = await evaluateLines(db, actor.workshopId, formula, lines, input.profile);
  return db.transaction(async (tx) => {
    const version = await repo.findVersion(tx, actor.workshopId, formulaId, n, true);
    if (!version) throw notFound(`Version ${n} of that formula`);
    if (version.state !== 'draft') throw immutable(n, version.state);
    await repo.updateVersion(tx, actor.workshopId, version.id, {
      profile: input.profile,
      notes: input.notes,
      ...evaluation,
    });
    await repo.replaceLines(tx, actor.workshopId, version.id, lines);
    await repo.updateFormula(tx, actor.workshopId, formulaId, {});
    await recordAudit(tx, actor, {
      action: 'formula.draft-saved',
      subjectType: 'formula',
      subjectId: formulaId,
      detail: { version: n, lines: lines.length },
    });
    const row = (await repo.findVersion(tx, actor.workshopId, formulaId, n))!;
    return versionView(tx, actor.workshopId, row);
  });
}

/** PATCH: merges the given parts into the stored draft, then saves it like PUT. */
export async function patchDraft(
  db: Database,
  actor: AuthUser,
  formulaId: string,
  n: number,
  body: unknown,
) {
  const version = await repo.findVersion(db, actor.workshopId, formulaId, n);
  if (!version) throw notFound(`Version ${n} of that formula`);
  if (version.state !== 'draft') throw immutable(n, version.state);
  const patch = (body && typeof body === 'object' ? body : {}) as Record<string, unknown>;
  const stored = await repo.findLines(db, actor.workshopId, version.id);
  const merged: Record<string, unknown> = {
    lines: stored.map((l) => ({
      materialId: l.materialId,
      grams: l.grams,
      substitutes: l.substitutes.map((s) => s.materialId),
    })),
    profile: version.profile,
    notes: version.notes,
    ...patch,
  };
  if ('byPercent' in patch && !('lines' in patch)) delete merged['lines'];
  return saveDraft(db, actor, formulaId, n, parse(formulaVersionInputSchema, merged));
}

/**
 * Starts a new draft copied from `fromVersion` (default: the latest). Only one draft may be open
 * at a time; the copy is re-evaluated, as its materials may have changed since.
 */
export async function newDraft(
  db: Database,
  actor: AuthUser,
  formulaId: string,
  fromVersion: number | undefined,
) {
  return db.transaction(async (tx) => {
    // Locking the formula serialises version numbering between concurrent requests.
    const formula = await repo.findFormula(tx, actor.workshopId, formulaId, true);
    if (!formula) throw notFound('That formula');
    const open = await repo.findVersionInState(tx, actor.workshopId, formulaId, 'draft');
    if (open) throw conflict(`Version ${open.number} is still a draft; edit it instead.`);
    const latest = await repo.latestVersionNumber(tx, actor.workshopId, formulaId);
    const source = await repo.findVersion(tx, actor.workshopId, formulaId, fromVersion ?? latest);
    if (!source) throw notFound(`Version ${fromVersion} of that formula`);
    // The approved substitutes come along with their lines.
    const lines = gramLines(await repo.findLines(tx, actor.workshopId, source.id));
    const evaluation = await evaluateLines(tx, actor.workshopId, formula, lines, source.profile);
    const versionId = await repo.insertVersion(tx, {
      workshopId: actor.workshopId,
      formulaId,
      number: latest + 1,
      profile: source.profile,
      notes: source.notes,
      ...evaluation,
    });
    await repo.replaceLines(tx, actor.workshopId, versionId, lines);
    await repo.updateFormula(tx, actor.workshopId, formulaId, {});
    await recordAudit(tx, actor, {
      action: 'formula.draft-started',
      subjectType: 'formula',
      subjectId: formulaId,
      detail: { version: latest + 1, copiedFrom: source.number },
    });
    const row = (await repo.findVersion(tx, actor.workshopId, formulaId, latest + 1))!;
    return versionView(tx, actor.workshopId, row);
  });
}

/** Why a release was refused once the fresh evaluation was stored. */
type ReleaseRefusal =
  { problems: string[] } | { blocks: ComplianceFinding[] } | { forbidden: true };

/** The refusal as the error the client reads: `release_blocked` carries the blocking findings. */
function refusalError(n: number, refusal: ReleaseRefusal) {
  if ('problems' in refusal) {
    return conflict(`Version ${n} cannot be checked yet: ${refusal.problems.join('; ')}`);
  }
  if ('forbidden' in refusal) return forbidden();
  const { blocks } = refusal;
  const list = blocks.map((f) => `${f.market ?? 'all markets'}: ${f.subject}`).join('; ');
  return new AppError(
    409,
    'release_blocked',
    `Version ${n} has ${blocks.length} blocking finding(s) (${list}). Resolve them, or the owner may override with a reason.`,
    undefined,
    blocks,
  );
}

/**
 * Releases a draft. It is re-evaluated first with the materials as they are now, and that fresh
 * evaluation is stored whatever follows; blocking findings refuse the release (409
 * `release_blocked` with the findings) unless the owner overrides with a reason, which is kept on
 * the version and in the audit log. The previously released version becomes superseded.
 */
export async function release(
  db: Database,
  actor: AuthUser,
  formulaId: string,
  n: number,
  request: z.output<typeof releaseSchema>,
) {
  const outcome = await db.transaction(async (tx): Promise<FormulaVersion | ReleaseRefusal> => {
    const formula = await repo.findFormula(tx, actor.workshopId, formulaId, true);
    if (!formula) throw notFound('That formula');
    const version = await repo.findVersion(tx, actor.workshopId, formulaId, n, true);
    if (!version) throw notFound(`Version ${n} of that formula`);
    if (version.state !== 'draft') throw immutable(n, version.state);
    const lines = gramLines(await repo.findLines(tx, actor.workshopId, version.id));
    const evaluation = await evaluateLines(tx, actor.workshopId, formula, lines, version.profile);
    await repo.updateVersion(tx, actor.workshopId, version.id, evaluation);
    // A refusal is returned, not thrown, so the transaction commits the fresh evaluation. An
    // approved substitute that cannot be checked refuses the release like the formula itself.
    if (!evaluation.evaluation || evaluation.evaluationProblems.length > 0)
      return { problems: evaluation.evaluationProblems };
    const blocks = evaluation.evaluation.findings.filter((f) => f.severity === 'block');
    if (blocks.length > 0 && !request.override) return { blocks };
    // Only the owner, usually the legally responsible person, may release over a block.
    if (blocks.length > 0 && actor.role !== 'owner') return { forbidden: true };
    const previous = await repo.findVersionInState(tx, actor.workshopId, formulaId, 'released');
    if (previous)
      await repo.updateVersion(tx, actor.workshopId, previous.id, { state: 'superseded' });
    const overrideReason = blocks.length > 0 ? request.override!.reason : null;
    await repo.updateVersion(tx, actor.workshopId, version.id, {
      state: 'released',
      releasedAt: new Date(),
      releasedBy: actor.id,
      overrideReason,
    });
    await repo.updateFormula(tx, actor.workshopId, formulaId, {});
    await recordAudit(tx, actor, {
      action: overrideReason ? 'formula.released-with-override' : 'formula.released',
      subjectType: 'formula_version',
      subjectId: version.id,
      detail: {
        formulaId,
        number: n,
        supersededNumber: previous?.number ?? null,
        blockCount: blocks.length,
        overrideReason,
        blocking: blocks.map((f) => ({ code: f.code, market: f.market, subject: f.subject })),
      },
    });
    return versionView(
      tx,
      actor.workshopId,
      (await repo.findVersion(tx, actor.workshopId, formulaId, n))!,
    );
  });
  if ('id' in outcome) return outcome;
  throw refusalError(n, outcome);
}

/**
 * Deletes a formula none of whose versions was ever released, and logs it. A released version is
 * the record of what was made and sold (labels and batches will name it), so such a formula is
 * archived instead.
 */
export async function deleteFormula(db: Database, actor: AuthUser, id: string) {
  await deleteLogged(db, actor, {
    subjectType: 'formula',
    label: 'That formula',
    id,
    find: (tx) => repo.findFormula(tx, actor.workshopId, id, true),
    check: async (tx) => {
      const released = await repo.countReleasedVersions(tx, actor.workshopId, id);
      if (released === 0) return;
      const which = released === 1 ? 'a version was' : `${released} versions were`;
      throw conflict(
        `This formula cannot be deleted: ${which} released, and a released version stays as the ` +
          'record of what was made. Archive it instead: it leaves the lists, and its versions ' +
          'stay readable.',
      );
    },
    remove: (tx) => repo.deleteFormula(tx, actor.workshopId, id),
    detail: (formula) => ({ name: formula.name }),
  });
}
