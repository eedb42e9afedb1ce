import type { ItemMethod, PartEffect } from '../schemas/change-items';

// Steel direction of a cut item: what the change does to the tool's steel and whether it can be undone.
//
// Plastic fills the space where there is no steel. Taking steel out of a cavity or core therefore
// always gives the part more plastic, and a part can only lose plastic if steel is added.
//
// The rules below are common practice, no published source, with TRADE-FACTS section 5
// ("Steel-safe" practice) as the nearest written support:
//  - removing steel is easy; adding it back is "immensely difficult" and means laser or micro-TIG
//    welding and re-machining, with weld risks (puertadiazengineering.com Playbook ch. 2;
//    moldmakingtechnology.com weld articles);
//  - to keep the original part available, cut the change into a new or duplicate insert and keep
//    the original insert (derived rule in TRADE-FACTS section 5; theswca.com on swapped cavities).
//
// What the steel does depends on the METHOD (it is what is done to the tool). The EFFECT (what the
// designer says happens to the part) is a cross-check: where the two contradict, the item is refused
// by `checkItemConsistency`, and until it is fixed its direction follows the method and it is
// treated as cannot-be-undone whenever the method touches the tool's own steel.

/**
 * remove: steel is cut, sparked, etched or polished out of the tool.
 * add:    steel is welded onto the tool and re-cut to shape.
 * swap:   a separate insert replaces the current one, which is kept.
 * none:   the tool's steel is left as it is (no current effect and method gives this; kept so a
 *         stored item of a future kind has a value).
 */
export const steelActions = ['remove', 'add', 'none', 'swap'] as const;
export type SteelAction = (typeof steelActions)[number];

/**
 * none:             nothing to undo.
 * reweld_and_recut: the old shape can only come back through a new weld-and-re-cut job on the same
 *                   steel. That is a new change with its own risks, not a restoration.
 * swap_back:        put the kept insert back; the old shape returns exactly.
 */
export const undoPaths = ['none', 'reweld_and_recut', 'swap_back'] as const;
export type UndoPath = (typeof undoPaths)[number];

export const steelActionLabels: Record<SteelAction, string> = {
  remove: 'Steel comes out',
  add: 'Steel is added (weld)',
  none: 'Steel untouched',
  swap: 'Insert swapped, old one kept',
};

export const undoPathLabels: Record<UndoPath, string> = {
  none: 'Nothing to undo',
  reweld_and_recut: 'Only by a new weld and re-cut (not a restoration)',
  swap_back: 'Swap the old insert back',
};

/** Which rule an item follows; shown beside the result and used in tests. */
export type SteelRule = 'removed_steel_stays_out' | 'weld_is_a_new_change' | 'old_insert_kept';

export const steelRuleBasis: Record<SteelRule, string> = {
  removed_steel_stays_out:
    'Common practice, no published source: steel that is cut out cannot be put back; getting the old shape back needs welding and re-cutting (see TRADE-FACTS section 5, steel-safe practice).',
  weld_is_a_new_change:
    'Common practice, no published source: a weld changes the steel for good and the old surface is gone under it; welding on part-forming steel risks cracks, porosity and texture that does not match (see TRADE-FACTS section 5).',
  old_insert_kept:
    'Common practice, no published source: a replacement insert leaves the current insert whole, so it can be put back (see TRADE-FACTS section 5, inserts).',
};

export interface SteelDirection {
  steelAction: SteelAction;
  undoPath: UndoPath;
  /** True when the tool can no longer mold the part as it was without a new change to its steel. */
  irreversible: boolean;
  /** Plain sentence for the item row and the change notice. */
  why: string;
  rule: SteelRule;
  /** Null when effect and method agree; otherwise the same message `checkItemConsistency` gives. */
  problem: string | null;
}

export interface SteelItem {
  effect: PartEffect;
  method: ItemMethod;
}

const CUT_HINT = 'If the tool itself must be cut to take the insert, add that as its own item with the method "cut".';

/** The message for an effect and method that contradict each other, or null when they agree. */
const contradictions: Record<PartEffect, Partial<Record<ItemMethod, string>>> = {
  gains_plastic: {
    weld_recut:
      'Welding adds steel, which takes plastic away. A part that gains plastic needs steel cut out: choose "Cut". If an old feature is also filled, record that as a separate item where the part loses plastic.',
    texture:
      'Texture changes only the surface. For a part that gains plastic in shape choose "Cut"; for a new finish choose "Surface finish only".',
    polish:
      'Polish changes only the surface. For a part that gains plastic in shape choose "Cut"; for a new finish choose "Surface finish only".',
  },
  loses_plastic: {
    cut: 'Cutting takes steel out, which gives the part more plastic. A part that loses plastic needs steel added: choose "Weld, then re-cut" or "Replacement insert".',
    texture:
      'Texturing takes steel out of the surface, so the part cannot lose plastic that way. Choose "Weld, then re-cut" or "Replacement insert", or choose "Surface finish only" if only the finish changes.',
    polish:
      'Polishing takes steel out of the surface, so the part cannot lose plastic that way. Choose "Weld, then re-cut" or "Replacement insert", or choose "Surface finish only" if only the finish changes.',
  },
  surface_only: {
    cut: 'A cut changes the shape of the part, not only its surface. Say whether the part gains plastic, or choose "Texture" or "Polish" for a finish change.',
    weld_recut:
      'Welding and re-cutting changes the shape of the part, not only its surface. Say whether the part loses plastic, or choose "Texture", "Polish" or "Replacement insert" for a finish change.',
  },
  insert_swapped: {
    cut: `Swapping an insert keeps the old insert, so nothing is cut from it: choose "Replacement insert". ${CUT_HINT}`,
    weld_recut: `Swapping an insert keeps the old insert, so nothing is welded onto it: choose "Replacement insert". ${CUT_HINT}`,
    texture:
      'Texturing changes the insert that is in the tool, so it is not a swap. If the replacement insert has a different finish, choose "Replacement insert" and describe the finish in the note.',
    polish:
      'Polishing changes the insert that is in the tool, so it is not a swap. If the replacement insert has a different finish, choose "Replacement insert" and describe the finish in the note.',
  },
};

/**
 * The shared check a form and the server both use: null when the effect and method agree,
 * otherwise a message for the `method` field.
 */
export function checkItemConsistency(item: SteelItem): string | null {
  return contradictions[item.effect]?.[item.method] ?? null;
}

const whyByMethod: Record<ItemMethod, (effect: PartEffect) => string> = {
  cut: () =>
    'Cutting takes steel out of the tool. Steel cannot be put back: getting the old part again means welding and re-cutting, a new change and not a restoration.',
  texture: () =>
    'Texturing etches or cuts steel out of the surface. The old surface cannot be put back: it would take welding and re-cutting, and welded steel may not take the texture the same way.',
  polish: () =>
    'Polishing takes a thin layer of steel off the surface. It cannot be put back: the old finish would need welding and re-cutting or re-texturing, and would not match exactly.',
  weld_recut: () =>
    'Welding adds steel, which is then re-cut to the new shape. The old surface is gone under the weld: getting the old part again means another weld and re-cut on the same steel, a new change and not a restoration.',
  new_insert: (effect) =>
    `${effect === 'insert_swapped' ? 'The change is a different insert' : 'The change is made on a replacement insert'}; the current insert is kept whole, so putting it back makes the old part again. ${CUT_HINT}`,
};

/** The steel action, undo path and reversibility of one cut item. */
export function steelDirection(item: SteelItem): SteelDirection {
  const problem = checkItemConsistency(item);
  const base = whyByMethod[item.method](item.effect);
  // Only methods that work on the tool's own steel can contradict an effect, so such an item is
  // counted as cannot-be-undone until it is fixed.
  const why = problem ? `${problem} Until this is fixed the item counts as cannot be undone. ${base}` : base;
  switch (item.method) {
    case 'cut':
    case 'texture':
    case 'polish':
      return { steelAction: 'remove', undoPath: 'reweld_and_recut', irreversible: true, why, rule: 'removed_steel_stays_out', problem };
    case 'weld_recut':
      return { steelAction: 'add', undoPath: 'reweld_and_recut', irreversible: true, why, rule: 'weld_is_a_new_change', problem };
    case 'new_insert':
      return { steelAction: 'swap', undoPath: 'swap_back', irreversible: false, why, rule: 'old_insert_kept', problem };
  }
}

/** True when any item changes the tool's steel for good. */
export const anyIrreversible = (items: readonly SteelItem[]): boolean => items.some((i) => steelDirection(i).irreversible);

/** True when any item takes steel out of the tool (as opposed to only welding or swapping inserts). */
export const anyRemovesSteel = (items: readonly SteelItem[]): boolean => items.some((i) => steelDirection(i).steelAction === 'remove');
