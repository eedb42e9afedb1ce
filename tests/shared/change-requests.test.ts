import { createRequestInput, updateRequestInput, uploadKindInput } from '../../shared/schemas/change-requests';

const TOOL = '3f0c8a52-6b1e-4c1e-9a51-0c5a3e0d9b11';
const PART = '9b2d4e61-7a3c-4f2b-8c6d-1e5f7a9b0c22';
const ITEM = '5c7e9a13-2b4d-4e6f-9a8b-3c5d7e9f1a33';
const item = (extra: Record<string, unknown> = {}) => ({ partId: PART, effect: 'gains_plastic', method: 'cut', size: '0.8', unit: 'mm', ...extra });

describe('change-request contract', () => {
  it('when an update leaves the reason out, then the parsed update has no reason (a field left out is kept, not blanked)', () => {
    const parsed = updateRequestInput.parse({ version: 3, title: 'New title' });
    expect(parsed).toEqual({ version: 3, title: 'New title' });
    expect('reason' in parsed).toBe(false);
  });

  it('when a create leaves the reason and items out, then they default to empty', () => {
    expect(createRequestInput.parse({ toolId: TOOL, title: 'Ridge' })).toMatchObject({ reason: '', items: [], movedProductIds: [], derivativeProductId: null, newDerivative: null });
  });

  it('when an item carries the id of an existing item, then it is kept; the same id twice is refused', () => {
    expect(updateRequestInput.parse({ version: 0, items: [item({ id: ITEM })] }).items![0]!.id).toBe(ITEM);
    const twice = updateRequestInput.safeParse({ version: 0, items: [item({ id: ITEM }), item({ id: ITEM })] });
    expect(twice.success).toBe(false);
    expect(twice.error!.issues[0]!.path).toEqual(['items', 1, 'id']);
  });

  it('when an item says the part loses plastic but the method is a cut, then the method is refused', () => {
    const r = updateRequestInput.safeParse({ version: 0, items: [item({ effect: 'loses_plastic' })] });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.path).toEqual(['items', 0, 'method']);
  });

  it('when an update names an existing derivative and a new one, then it is refused on newDerivative', () => {
    const r = updateRequestInput.safeParse({ version: 0, derivativeProductId: TOOL, newDerivative: { sku: 'SR-2000', name: 'Storm Kite II' } });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.path).toEqual(['newDerivative']);
  });

  it('when the target date does not exist on the calendar, then it is refused (2027 is not a leap year)', () => {
    expect(createRequestInput.safeParse({ toolId: TOOL, title: 'Ridge', targetDate: '2027-02-29' }).success).toBe(false);
    expect(createRequestInput.safeParse({ toolId: TOOL, title: 'Ridge', targetDate: '2028-02-29' }).success).toBe(true);
  });

  it('when a product is moved twice, then it is refused', () => {
    expect(updateRequestInput.safeParse({ version: 0, movedProductIds: [TOOL, TOOL] }).success).toBe(false);
  });

  it('when an upload form sends an empty item field, then it means no item', () => {
    expect(uploadKindInput.parse({ kind: 'before', itemId: '' })).toEqual({ kind: 'before' });
    expect(uploadKindInput.safeParse({ kind: 'poster' }).success).toBe(false);
  });
});
