import request from 'supertest';
import { expect } from 'vitest';
import { aFormula } from '../../fixtures/builders/formula-builder';
import { aProductIdentity, aWorkshopLabelDetails } from '../../fixtures/builders/label-run-builder';
import type { ProductIdentityInput } from '@batchproof/shared';
import { buildMaterial } from './row-builders';
import type { BuiltWorkshop } from './workshop-builder';
import type { ApiHarness } from './api-harness';
import { bearer } from './auth-header';

/** Gives the workshop a business address, so its labels can name the maker in full. */
export async function giveAddress(h: ApiHarness, w: BuiltWorkshop) {
  const res = await request(h.app)
    .put('/api/workshop/label-details')
    .set(bearer(w.members.owner))
    .send(aWorkshopLabelDetails());
  expect(res.status).toBe(200);
}

/**
 * A released formula of the workshop (one material), with a complete product identity unless
 * `identity` is null. The workshop needs an address ({@link giveAddress}) to print it.
 */
export async function releasedFormula(
  h: ApiHarness,
  w: BuiltWorkshop,
  identity: Partial<ProductIdentityInput> | null = {},
) {
  const owner = bearer(w.members.owner);
  const material = await buildMaterial(h.handle.db, w.id);
  const created = await request(h.app)
    .post('/api/formulas')
    .set(owner)
    .send(aFormula([{ materialId: material.id, grams: 100 }]));
  expect(created.status).toBe(201);
  const id = created.body.id as string;
  const released = await request(h.app)
    .post(`/api/formulas/${id}/versions/1/release`)
    .set(owner)
    .send({});
  expect(released.status).toBe(200);
  if (identity) {
    const put = await request(h.app)
      .put(`/api/formulas/${id}/identity`)
      .set(owner)
      .send(aProductIdentity(identity));
    expect(put.status).toBe(200);
  }
  return id;
}
