import type { MaterialInput } from '../compliance/evaluation-input-schema';
import type { Material } from './material-schema';

/** The stored fields the compliance engine reads from a material. */
export type EngineMaterialSource = Pick<
  Material,
  | 'tradeName'
  | 'inci'
  | 'usName'
  | 'functions'
  | 'colourIndex'
  | 'components'
  | 'ifraCertificate'
  | 'allergenDeclaration'
>;

/**
 * Maps a stored material onto the compliance engine's line material, so the editor's live check
 * and the server's check on save read exactly the same thing. A fragrance or essential oil with
 * neither certificate nor declaration is passed without `fragrance`, which the engine reports as
 * missing data rather than guessing.
 */
export function materialToEngineInput(m: EngineMaterialSource): MaterialInput {
  const hasScentData = m.ifraCertificate !== null || m.allergenDeclaration !== null;
  return {
    name: m.tradeName,
    inci: m.inci,
    ...(m.usName ? { usName: m.usName } : {}),
    functions: m.functions,
    ...(m.colourIndex ? { colourIndex: m.colourIndex } : {}),
    ...(m.components.length > 0 ? { components: m.components } : {}),
    ...(hasScentData
      ? {
          fragrance: {
            maxPercentByIfraCategory: m.ifraCertificate?.maxPercentByIfraCategory ?? {},
            allergens: m.allergenDeclaration?.allergens ?? [],
          },
        }
      : {}),
  };
}
