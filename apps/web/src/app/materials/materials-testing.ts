import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { expect, vi } from 'vitest';
import type { Material, MaterialSummary } from '@batchproof/shared';

/** Test data for specs that show materials (imported by specs only). */

const STAMP = '2026-11-01T10:00:00.000Z';

/** A full material record as `GET /api/materials?ids=` returns it. */
export function aMaterial(id: string, fields: Partial<Material>): Material {
  return {
    id,
    createdAt: STAMP,
    updatedAt: STAMP,
    tradeName: 'Material',
    inci: 'Aqua',
    usName: null,
    cas: null,
    ec: null,
    functions: [],
    category: 'other',
    supplierId: null,
    supplierName: null,
    notes: null,
    colourIndex: null,
    nano: false,
    components: [],
    ifraCertificate: null,
    allergenDeclaration: null,
    weightPerVolume: {},
    calibrations: [],
    calibrationSummary: [],
    ...fields,
  };
}

/** The list row of a material. */
export function summaryOf(m: Material): MaterialSummary {
  const { id, tradeName, inci, usName, cas, category, supplierId, supplierName } = m;
  return {
    id,
    tradeName,
    inci,
    usName,
    cas,
    category,
    supplierId,
    supplierName,
    colourIndex: m.colourIndex,
    functions: m.functions,
    updatedAt: m.updatedAt,
  };
}

/** Whether a request is the read of full records by id (the one material read model). */
export const isMaterialsRead = (r: HttpRequest<unknown>) =>
  r.method === 'GET' && r.url === '/api/materials' && r.params.has('ids');

/**
 * Waits for the one `GET /api/materials?ids=` read, checks that it names exactly `materials`
 * and answers it with them.
 */
export async function answerMaterialsRead(
  backend: HttpTestingController,
  materials: Material[],
): Promise<void> {
  const read = await vi.waitFor(() => backend.expectOne(isMaterialsRead));
  expect(read.request.params.get('ids')!.split(',').sort()).toEqual(
    materials.map((m) => m.id).sort(),
  );
  read.flush({ items: materials });
}
