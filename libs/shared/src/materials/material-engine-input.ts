import type { MaterialInput } from '../compliance/evaluation-input-schema';
import type { Material } from './material-schema';

/** The stored fields the compliance engine reads from a material. */
export type EngineMaterialSource = Pick<
  Material,
  | 'tradeName'
  | 'inci'
  | 'usName'
  | 'cas'
  | 'category'
  | 'functions'
  | 'colourIndex'
  | 'nano'
  | 'components'
  | 'ifraCertificate'
  | 'allergenDeclaration'
>;

const CAS_NUMBER = /\b\d{2,7}-\d{2}-\d\b/;

/**
 * Maps a stored material onto the compliance engine's line material, so the editor's live check
 * and the server's check on save read exactly the same thing. A fragrance or essential oil with
 * neither certificate nor declaration is passed without `fragrance`, which the engine reports as
 * missing data rather than guessing. The first CAS number written in the CAS field is passed on.
 */
export function materialToEngineInput(m: EngineMaterialSource): MaterialInput {
  const hasScentData = m.ifraCertificate !== null || m.allergenDeclaration !== null;
  const cas = m.cas ? CAS_NUMBER.exec(m.cas)?.[0] : undefined;
  return {
    name: m.tradeName,
    inci: m.inci,
    ...(m.usName ? { usName: m.usName } : {}),
    functions: m.functions,
    category: m.category,
    ...(m.colourIndex ? { colourIndex: m.colourIndex } : {}),
    ...(cas ? { cas } : {}),
    ...(m.nano ? { nano: true } : {}),
    ...(m.components.length > 0 ? { components: m.components } : {}),
    ...(hasScentData
      ? {
          fragrance: {
            maxPercentByIfraCategory: m.ifraCertificate?.maxPercentByIfraCategory ?? {},
            allergens: m.allergenDeclaration?.allergens ?? [],
            allergensDeclared: m.allergenDeclaration !== null,
          },
        }
      : {}),
  };
}
