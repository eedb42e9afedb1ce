import { itemMethods, partEffects, type ItemMethod, type PartEffect } from '../../shared/schemas/change-items';
import {
  anyIrreversible,
  anyRemovesSteel,
  checkItemConsistency,
  steelDirection,
  type SteelAction,
  type SteelRule,
  type UndoPath,
} from '../../shared/domain/steel-direction';

// Every effect x method, with the expected steel action, undo path and the rule it follows.
// All rules here are common practice, no published source. The nearest written support is
// TRADE-FACTS section 5: removing steel is easy, adding it back is "immensely difficult" and means
// welding and re-machining (puertadiazengineering.com Playbook ch. 2); keeping the original part
// means cutting the change into a new insert and keeping the original one (derived rule, section 5).
//
// Plastic fills where steel is not: removing steel always gives the part more plastic, and a part
// can only lose plastic if steel is added. An effect that contradicts its method is refused.
type Row = [PartEffect, ItemMethod, SteelAction, UndoPath, boolean /* irreversible */, boolean /* consistent */, SteelRule];

const R = 'removed_steel_stays_out' as const; // common practice: steel cut out cannot be put back
const W = 'weld_is_a_new_change' as const; // common practice: a weld is a new change, not a restoration
const I = 'old_insert_kept' as const; // common practice: a replacement insert keeps the old one

const table: Row[] = [
  // part gains plastic: steel comes out of the tool
  ['gains_plastic', 'cut', 'remove', 'reweld_and_recut', true, true, R],
  ['gains_plastic', 'weld_recut', 'add', 'reweld_and_recut', true, false, W], // welding takes plastic away
  ['gains_plastic', 'new_insert', 'swap', 'swap_back', false, true, I], // change cut into a new insert
  ['gains_plastic', 'texture', 'remove', 'reweld_and_recut', true, false, R], // texture is surface only
  ['gains_plastic', 'polish', 'remove', 'reweld_and_recut', true, false, R], // polish is surface only
  // part loses plastic: steel must be added
  ['loses_plastic', 'cut', 'remove', 'reweld_and_recut', true, false, R], // a cut gives more plastic
  ['loses_plastic', 'weld_recut', 'add', 'reweld_and_recut', true, true, W],
  ['loses_plastic', 'new_insert', 'swap', 'swap_back', false, true, I],
  ['loses_plastic', 'texture', 'remove', 'reweld_and_recut', true, false, R],
  ['loses_plastic', 'polish', 'remove', 'reweld_and_recut', true, false, R],
  // surface only: texture and polish take steel off the surface
  ['surface_only', 'cut', 'remove', 'reweld_and_recut', true, false, R], // a cut changes shape
  ['surface_only', 'weld_recut', 'add', 'reweld_and_recut', true, false, W], // a weld changes shape
  ['surface_only', 'new_insert', 'swap', 'swap_back', false, true, I], // new finish on a new insert
  ['surface_only', 'texture', 'remove', 'reweld_and_recut', true, true, R],
  ['surface_only', 'polish', 'remove', 'reweld_and_recut', true, true, R],
  // insert swapped: the old insert is kept
  ['insert_swapped', 'cut', 'remove', 'reweld_and_recut', true, false, R],
  ['insert_swapped', 'weld_recut', 'add', 'reweld_and_recut', true, false, W],
  ['insert_swapped', 'new_insert', 'swap', 'swap_back', false, true, I],
  ['insert_swapped', 'texture', 'remove', 'reweld_and_recut', true, false, R],
  ['insert_swapped', 'polish', 'remove', 'reweld_and_recut', true, false, R],
];

describe('steel direction', () => {
  it('when the table is listed, then it covers every effect x method exactly once', () => {
    const keys = table.map(([e, m]) => `${e}/${m}`);
    expect(new Set(keys).size).toBe(partEffects.length * itemMethods.length);
    for (const e of partEffects) for (const m of itemMethods) expect(keys).toContain(`${e}/${m}`);
  });

  it.each(table)(
    'when a part %s by %s, then steel %s, undo %s, irreversible %s, consistent %s (rule %s)',
    (effect, method, steelAction, undoPath, irreversible, consistent, rule) => {
      const d = steelDirection({ effect, method });
      expect(d).toMatchObject({ steelAction, undoPath, irreversible, rule });
      expect(d.problem === null).toBe(consistent);
      expect(checkItemConsistency({ effect, method }) === null).toBe(consistent);
      expect(d.why.length).toBeGreaterThan(20);
    },
  );

  it('when an item cannot be undone, then its undo path is never "swap back" and its sentence says so', () => {
    for (const [effect, method] of table) {
      const d = steelDirection({ effect, method });
      if (d.irreversible) {
        expect(d.undoPath).toBe('reweld_and_recut');
        expect(d.why).toMatch(/not a restoration|cannot be put back/);
      } else {
        expect(d.undoPath).toBe('swap_back');
        expect(d.why).toMatch(/kept/);
      }
    }
  });

  it('when effect and method contradict, then the message names a method that fits and the item counts as cannot be undone', () => {
    const msg = checkItemConsistency({ effect: 'gains_plastic', method: 'weld_recut' });
    expect(msg).toMatch(/choose "Cut"/);
    const d = steelDirection({ effect: 'loses_plastic', method: 'cut' });
    expect(d.problem).toMatch(/Weld, then re-cut/);
    expect(d.why).toMatch(/counts as cannot be undone/);
    expect(d.irreversible).toBe(true);
  });

  it('when a request mixes an insert swap and a cut, then it is irreversible and removes steel', () => {
    const swap = { effect: 'insert_swapped', method: 'new_insert' } as const;
    const cut = { effect: 'gains_plastic', method: 'cut' } as const;
    const weld = { effect: 'loses_plastic', method: 'weld_recut' } as const;
    expect(anyIrreversible([swap])).toBe(false);
    expect(anyIrreversible([swap, cut])).toBe(true);
    expect(anyRemovesSteel([swap, weld])).toBe(false);
    expect(anyIrreversible([swap, weld])).toBe(true);
    expect(anyRemovesSteel([weld, cut])).toBe(true);
  });
});
