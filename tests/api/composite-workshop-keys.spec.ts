import { randomUUID } from 'node:crypto';
import { eq, sql, TransactionRollbackError } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DatabaseHandle } from '../../apps/api/src/db/database';
import { formulaVersions, materials, suppliers, users } from '../../apps/api/src/db/schema';
import { buildLot, buildMaterial, buildSupplier } from '../support/row-builders';
import { openMigratedTestDatabase } from '../support/test-database';
import { addMember, buildWorkshop } from '../support/workshop-builder';
import { TEST_JWT_SECRET } from '../support/api-harness';

// The application filters every query by workshop; these checks are about the database on its
// own: a row that points into another workshop is refused by a composite foreign key
// (workshop_id, x_id) → (workshop_id, id), whichever code path writes it.

interface WorkshopRecords {
  workshopId: string;
  userId: string;
  supplierId: string;
  materialId: string;
  lotId: string;
  formulaId: string;
  versionId: string;
}

let handle: DatabaseHandle;
let mine: WorkshopRecords;
let theirs: WorkshopRecords;

/** A workshop with one of each record another workshop table can point at. */
async function workshopWithRecords(): Promise<WorkshopRecords> {
  const db = handle.db;
  const workshop = await buildWorkshop(db, TEST_JWT_SECRET, { roles: ['owner'] });
  const supplier = await buildSupplier(db, workshop.id);
  const material = await buildMaterial(db, workshop.id);
  const lot = await buildLot(db, workshop.id, material.id);
  const formula = await db.execute<{ id: string }>(sql`
    insert into formulas (workshop_id, name, product_type)
    values (${workshop.id}, 'Probe', 'fizzer') returning id`);
  const formulaId = formula.rows[0]!.id;
  const version = await db.execute<{ id: string }>(sql`
    insert into formula_versions (workshop_id, formula_id, number, profile)
    values (${workshop.id}, ${formulaId}, 1, '{}'::jsonb) returning id`);
  return {
    workshopId: workshop.id,
    userId: workshop.members.owner.id,
    supplierId: supplier.id,
    materialId: material.id,
    lotId: lot.id,
    formulaId,
    versionId: version.rows[0]!.id,
  };
}

beforeAll(async () => {
  handle = await openMigratedTestDatabase();
  mine = await workshopWithRecords();
  theirs = await workshopWithRecords();
});
afterAll(() => handle.close());

/** The PostgreSQL error under Drizzle's wrapper. */
async function databaseError(statement: Promise<unknown>) {
  try {
    await statement;
  } catch (error) {
    // Drizzle wraps the driver's error (code, constraint) as `cause`.
    const cause = (error as { cause?: unknown }).cause ?? error;
    return cause as { code?: string; constraint?: string };
  }
  return undefined;
}

/** Each reference between workshop tables, as an insert into `mine` pointing at `target`. */
const references: {
  constraint: string;
  insert: (target: WorkshopRecords) => ReturnType<typeof sql>;
}[] = [
  {
    constraint: 'materials_supplier_fk',
    insert: (t) => sql`insert into materials (workshop_id, supplier_id, trade_name, inci, category)
      values (${mine.workshopId}, ${t.supplierId}, 'Probe', 'Probe', 'base')`,
  },
  {
    constraint: 'lots_material_fk',
    insert: (
      t,
    ) => sql`insert into lots (workshop_id, material_id, supplier_lot_number, quantity, unit, received_on)
      values (${mine.workshopId}, ${t.materialId}, 'L-1', 1, 'kg', '2025-01-01')`,
  },
  {
    constraint: 'lot_consumptions_lot_fk',
    insert: (t) => sql`insert into lot_consumptions (workshop_id, lot_id, quantity, kind, reason)
      values (${mine.workshopId}, ${t.lotId}, 1, 'adjustment', 'other')`,
  },
  ...(['material', 'lot'] as const).map((owner) => ({
    constraint: `documents_${owner}_fk`,
    insert: (t: WorkshopRecords) => sql`insert into documents
      (workshop_id, material_id, lot_id, kind, title, issued_on, filename, mime_type, size_bytes, sha256, content)
      values (${mine.workshopId}, ${owner === 'material' ? t.materialId : null},
        ${owner === 'lot' ? t.lotId : null}, 'sds', 'Probe', '2025-01-01', 'p.pdf',
        'application/pdf', 1, 'x', '\\x25'::bytea)`,
  })),
  {
    constraint: 'documents_uploaded_by_fk',
    insert: (t) => sql`insert into documents
      (workshop_id, material_id, uploaded_by, kind, title, issued_on, filename, mime_type, size_bytes, sha256, content)
      values (${mine.workshopId}, ${mine.materialId}, ${t.userId}, 'sds', 'Probe', '2025-01-01',
        'p.pdf', 'application/pdf', 1, 'x', '\\x25'::bytea)`,
  },
  {
    constraint: 'formula_versions_formula_fk',
    insert: (
      t,
    ) => sql`insert into formula_versions (workshop_id, formula_id, number, state, profile)
      values (${mine.workshopId}, ${t.formulaId}, 7, 'superseded', '{}'::jsonb)`,
  },
  {
    constraint: 'formula_versions_released_by_fk',
    insert: (t) => sql`update formula_versions set released_by = ${t.userId}
      where id = ${mine.versionId}`,
  },
  {
    constraint: 'formula_lines_version_fk',
    insert: (
      t,
    ) => sql`insert into formula_lines (workshop_id, version_id, position, material_id, grams)
      values (${mine.workshopId}, ${t.versionId}, 1, ${mine.materialId}, 1)`,
  },
  {
    constraint: 'formula_lines_material_fk',
    insert: (
      t,
    ) => sql`insert into formula_lines (workshop_id, version_id, position, material_id, grams)
      values (${mine.workshopId}, ${mine.versionId}, 1, ${t.materialId}, 1)`,
  },
  {
    constraint: 'audit_events_actor_fk',
    insert: (t) => sql`insert into audit_events (workshop_id, actor_id, action, subject_type)
      values (${mine.workshopId}, ${t.userId}, 'probe', 'probe')`,
  },
  {
    constraint: 'invitations_invited_by_fk',
    insert: (
      t,
    ) => sql`insert into invitations (workshop_id, email, role, token_hash, invited_by, expires_at)
      values (${mine.workshopId}, 'p@test.example', 'viewer', ${randomUUID()}, ${t.userId}, now())`,
  },
  {
    constraint: 'password_resets_user_fk',
    insert: (t) => sql`insert into password_resets (workshop_id, user_id, token_hash, expires_at)
      values (${mine.workshopId}, ${t.userId}, ${randomUUID()}, now())`,
  },
  {
    constraint: 'refresh_sessions_user_fk',
    insert: (t) => sql`insert into refresh_sessions (workshop_id, user_id, token_hash, expires_at)
      values (${mine.workshopId}, ${t.userId}, ${randomUUID()}, now())`,
  },
  {
    constraint: 'idempotency_keys_user_fk',
    insert: (t) => sql`insert into idempotency_keys (workshop_id, user_id, key, request_hash)
      values (${mine.workshopId}, ${t.userId}, ${randomUUID()}, 'x')`,
  },
];

describe('composite workshop keys: the database refuses a row pointing into another workshop', () => {
  it.each(references)('$constraint refuses a reference to another workshop', async (ref) => {
    const error = await databaseError(handle.db.execute(ref.insert(theirs)));
    expect(error).toMatchObject({ code: '23503', constraint: ref.constraint }); // foreign_key_violation
  });

  it.each(references)('$constraint accepts a reference within the workshop', async (ref) => {
    await handle.db
      .transaction(async (tx) => {
        await tx.execute(ref.insert(mine));
        tx.rollback();
      })
      .catch((error: Error) => {
        // Drizzle's rollback() throws to abandon the transaction; anything else is a failure.
        if (!(error instanceof TransactionRollbackError)) throw error;
      });
  });

  it('deleting a member clears only the reference, keeping the version in its workshop', async () => {
    const member = await addMember(handle.db, TEST_JWT_SECRET, mine.workshopId, 'formulator');
    await handle.db
      .update(formulaVersions)
      .set({ releasedBy: member.id })
      .where(eq(formulaVersions.id, mine.versionId));
    await handle.db.delete(users).where(eq(users.id, member.id));
    const [row] = await handle.db
      .select()
      .from(formulaVersions)
      .where(eq(formulaVersions.id, mine.versionId));
    expect(row).toMatchObject({ releasedBy: null, workshopId: mine.workshopId });
  });

  it('a supplier that a material names cannot be deleted (archive it instead)', async () => {
    const supplier = await buildSupplier(handle.db, mine.workshopId);
    const material = await buildMaterial(handle.db, mine.workshopId);
    await handle.db
      .update(materials)
      .set({ supplierId: supplier.id })
      .where(eq(materials.id, material.id));
    const error = await databaseError(
      handle.db.delete(suppliers).where(eq(suppliers.id, supplier.id)),
    );
    expect(error).toMatchObject({ code: '23503', constraint: 'materials_supplier_fk' });
  });

  it('every foreign key between two workshop tables includes workshop_id on both sides', async () => {
    // The catalogue, so a table added later without a composite key fails here too.
    const result = await handle.db.execute<{
      constraint: string;
      from: string[];
      to: string[];
    }>(sql`
      select c.conname as constraint,
        array(select attname::text from unnest(c.conkey) k join pg_attribute a
              on a.attrelid = c.conrelid and a.attnum = k) as from,
        array(select attname::text from unnest(c.confkey) k join pg_attribute a
              on a.attrelid = c.confrelid and a.attnum = k) as to
      from pg_constraint c
      where c.contype = 'f'
        and c.confrelid <> 'workshops'::regclass
        and exists (select 1 from pg_attribute where attrelid = c.conrelid and attname = 'workshop_id')
        and exists (select 1 from pg_attribute where attrelid = c.confrelid and attname = 'workshop_id')`);
    const singleColumn = result.rows.filter(
      (fk) => !fk.from.includes('workshop_id') || !fk.to.includes('workshop_id'),
    );
    expect(result.rows.length).toBeGreaterThanOrEqual(references.length);
    expect(singleColumn).toEqual([]);
  });
});
