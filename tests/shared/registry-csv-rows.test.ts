import { productCsvRow, toolCsvRow } from '../../shared/schemas/registry';

describe('CSV rows with only the required columns', () => {
  it('when a tools row leaves out every optional column, then it parses with those values not given', () => {
    const r = toolCsvRow.safeParse({
      code: 'KB-T-0999',
      name: 'Spare visor tool',
      brand_code: 'sr',
      factory: 'Harbourline Plastics',
      construction: 'pre_hardened_steel',
      mold_class: '103',
      cavity_count: '2',
    });
    expect(r.success).toBe(true);
    expect(r.data).toMatchObject({ brand_code: 'SR', mold_class: 103, cavity_count: 2 });
    expect(r.data?.rated_shots).toBeUndefined();
    expect(r.data?.weight_kg).toBeUndefined();
    expect(r.data?.build_cost).toBeUndefined();
    expect(r.data?.status).toBeUndefined();
  });

  it('when an optional cell is present but empty, then it is also not given', () => {
    const r = toolCsvRow.safeParse({
      code: 'KB-T-0998', name: 'Spare tool', brand_code: 'SR', factory: 'Harbourline Plastics',
      construction: 'aluminium', mold_class: '104', cavity_count: '1', weight_kg: '', currency: '', status: '',
    });
    expect(r.success).toBe(true);
    expect(r.data?.weight_kg).toBeUndefined();
  });

  it('when a products row has only sku, name and brand, then it parses', () => {
    expect(productCsvRow.safeParse({ sku: 'SR-9001', name: 'Spare figure', brand_code: 'SR' }).success).toBe(true);
  });

  it('when an optional cell holds a bad value, then the row is still refused', () => {
    const r = toolCsvRow.safeParse({
      code: 'KB-T-0997', name: 'Spare tool', brand_code: 'SR', factory: 'Harbourline Plastics',
      construction: 'aluminium', mold_class: '104', cavity_count: '1', weight_kg: 'heavy',
    });
    expect(r.success).toBe(false);
  });
});
