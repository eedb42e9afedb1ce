import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, fireEvent, render, screen } from '@testing-library/react';
import type { ReactNode } from 'react';
import { computeRequestNumbers, type NumbersFacts } from '@shared/domain/request-numbers';
import { numbersInputsSchema, type NumbersInputsInput, type RequestNumbers } from '@shared/schemas/numbers';
import { EstimateForm } from '@/features/numbers/components/estimate-form';
import { NumbersCard } from '@/features/numbers/components/numbers-card';
import { OpenPlansView } from '@/features/numbers/components/open-plans-card';
import { numbersFormSchema, toFormValues, toLiveInputs, toNumbersPayload, type NumbersFormValues } from '@/features/numbers/forms';
import { openPlansVersusLife } from '@shared/domain/request-numbers';

const facts: NumbersFacts = {
  tool: { id: '11111111-1111-4111-8111-111111111111', code: 'KB-T-0412', ratedShots: 500_000, shotCount: 212_400, ratedShotsSource: 'Class 103', currency: 'USD' },
  derivative: { id: '22222222-2222-4222-8222-222222222222', sku: 'SR-1002', name: 'Storm Kite', plannedUnits: 60_000, fobCents: 325, wholesaleCents: 680, retailCents: 1399, currency: 'USD' },
  parts: [{ id: '33333333-3333-4333-8333-333333333333', name: 'Head', resin: 'ABS', cavitiesPerShot: 2, derivativeQuantityPerUnit: null }],
  ended: [{ id: '44444444-4444-4444-8444-444444444444', sku: 'SR-1001', name: 'Ranger Kite', plannedUnits: 40_000 }],
};

const withInputs = (i: NumbersInputsInput) => {
  const inputs = numbersInputsSchema.parse(i);
  return { inputs, result: computeRequestNumbers(inputs, facts) };
};

describe('NumbersCard', () => {
  it('when the estimate is in, then the verdict in words comes first and the figures carry the currency', () => {
    const { result } = withInputs({ estimate: { modificationCostCents: 680_000, newInsertCents: 1_450_000 }, plan: { freightPerUnitCents: 22, dutyPercent: '0', scrapRate: '0.03' } });
    render(<NumbersCard result={result} facts={facts} />);
    // 680,000 / (680 - 347) = 2,042.04 -> 2,043 (Stanford EE204 break-even, rounded up).
    expect(screen.getByTestId('numbers-card-verdict-sentence').textContent).toBe('Pays back after 2,043 units of 60,000 planned');
    expect(screen.getByTestId('numbers-card-cost').textContent).toBe('$6,800.00');
    expect(screen.getByTestId('numbers-card-per-unit').textContent).toBe('$0.12');
    expect(screen.getByTestId('numbers-card-break-even').textContent).toBe('2,043 units');
    expect(screen.getByTestId('numbers-card-life-title').textContent).toBe('The tool lasts the run');
    expect(screen.getByTestId('numbers-card-new_insert').textContent).toBe('$14,500.00');
  });

  it('when the run outruns the tool, then an amber warning says so in words', () => {
    const { result } = withInputs({ plan: { plannedUnits: 700_000 } });
    const { container } = render(<NumbersCard result={result} facts={facts} />);
    expect(screen.getByTestId('numbers-card-life-title').textContent).toBe('Warning: the tool runs short');
    expect(screen.getByTestId('numbers-card-life').textContent).toMatch(/short/);
    expect(container.querySelector('svg')).not.toBeNull();
    expect(screen.getByTestId('numbers-card-verdict-sentence').textContent).toMatch(/^Payback not known yet/);
  });

  it('when the phone layout opens the build-up, then landed cost and margins show', () => {
    const { result } = withInputs({ estimate: { modificationCostCents: 680_000 }, plan: { freightPerUnitCents: 22, dutyPercent: '0' } });
    render(<NumbersCard result={result} facts={facts} compact />);
    expect(screen.queryByTestId('numbers-buildup')).toBeNull();
    fireEvent.click(screen.getByTestId('numbers-card-more'));
    expect(screen.getByTestId('numbers-landed').textContent).toBe('$3.47');
    expect(screen.getByTestId('numbers-buildup').textContent).toContain('brand margin 48.97 %');
  });
});

describe('OpenPlansView', () => {
  it('when the plans outrun the tool, then the warning and the shortfall show', () => {
    const total = openPlansVersusLife(20_000, [{ shotsNeeded: 12_813 }, { shotsNeeded: 8_000 }]);
    render(
      <OpenPlansView
        data={{ tool: { id: facts.tool.id, code: 'KB-T-0412', ratedShots: 40_000, shotCount: 20_000, ratedShotsSource: 'Mold maker' }, plans: [], total }}
      />,
    );
    expect(screen.getByTestId('open-plans-verdict').textContent).toContain('Warning: the open plans outrun the tool');
    expect(screen.getByTestId('open-plans-shortfall').textContent).toBe('813');
  });
});

describe('EstimateForm', () => {
  it('when the engineer types a new cost, then the live figures change at once, before saving', async () => {
    const { inputs, result } = withInputs({ estimate: { modificationCostCents: 680_000 }, plan: { freightPerUnitCents: 22, dutyPercent: '0' } });
    const numbers: RequestNumbers = {
      requestId: '55555555-5555-4555-8555-555555555555',
      version: 3,
      status: 'engineering_review',
      canEdit: true,
      readOnlyReason: null,
      inputs,
      facts,
      result,
      updatedAt: '2027-01-01T00:00:00.000Z',
    };
    const qc = new QueryClient();
    const wrap = ({ children }: { children: ReactNode }) => <QueryClientProvider client={qc}>{children}</QueryClientProvider>;
    render(<EstimateForm numbers={numbers} onDone={() => {}} />, { wrapper: wrap });
    expect(screen.getByTestId('numbers-live-verdict-sentence').textContent).toBe('Pays back after 2,043 units of 60,000 planned');
    await act(async () => {
      fireEvent.change(screen.getByTestId('estimate-modificationCost'), { target: { value: '13,320.00' } });
    });
    // 1,332,000 / 333 = 4,000 exactly.
    expect(screen.getByTestId('numbers-live-verdict-sentence').textContent).toBe('Pays back after 4,000 units of 60,000 planned');
    expect(screen.getByTestId('numbers-live-live').textContent).toContain('Not saved yet');
  });
});

describe('estimate form rules', () => {
  const base = toFormValues(numbersInputsSchema.parse({}), 'USD');
  const yupOk = (v: NumbersFormValues) => numbersFormSchema.isValidSync(v);
  const zodOk = (v: NumbersFormValues) => numbersInputsSchema.safeParse(toNumbersPayload(v, 'USD')).success;
  it.each<[string, Partial<NumbersFormValues>]>([
    ['nothing entered', {}],
    ['a cost with thousands commas', { modificationCost: '12,500.00' }],
    ['a cost with three decimals', { modificationCost: '12.505' }],
    ['a badly grouped cost', { modificationCost: '1,25,00' }],
    ['a negative cost', { modificationCost: '-5' }],
    ['fractional lead days', { leadDays: '2.5' }],
    ['zero planned units', { plannedUnits: '0' }],
    ['a scrap of 3 %', { scrapPercent: '3' }],
    ['a scrap of 100 %', { scrapPercent: '100' }],
    ['a duty of 1000 %', { dutyPercent: '1000' }],
    ['a duty of 1000.5 %', { dutyPercent: '1000.5' }],
    ['an unknown currency', { currency: 'XQZ' }],
    ['yen without decimals', { currency: 'JPY', fob: '350' }],
    ['yen with decimals', { currency: 'JPY', fob: '350.50' }],
    ['a dimension check without the new size', { dimensionOn: true, oldPartMm: '31.2', resinId: 'abs' }],
    ['a full dimension check', { dimensionOn: true, oldPartMm: '31.2', newPartMm: '32', resinId: 'abs', shrinkPercent: '0.55' }],
    ['a shrink of 10 %', { dimensionOn: true, oldPartMm: '31.2', newPartMm: '32', resinId: 'abs', shrinkPercent: '10' }],
    ['a clamp check', { clampOn: true, projectedArea: '41.5', factorId: 'ji_horng_abs', safetyFactor: '1.1', pressTonnage: '90' }],
    ['a safety factor below 1', { clampOn: true, projectedArea: '41.5', factorId: 'ji_horng_abs', safetyFactor: '0.9' }],
  ])('when the form holds %s, then yup and zod agree', (_n, change) => {
    const v = { ...base, ...change };
    expect(yupOk(v)).toBe(zodOk(v));
  });

  it('when money is typed, then it converts to exact cents and percents to exact fractions', () => {
    const p = toNumbersPayload({ ...base, modificationCost: '12,500.10', scrapPercent: '3', shrinkPercent: '0.55' }, 'USD');
    expect(p.estimate?.modificationCostCents).toBe(1_250_010);
    expect(p.plan?.scrapRate).toBe('0.03');
    // A half-typed field counts as empty in the live figures instead of breaking them.
    expect(toLiveInputs({ ...base, modificationCost: '12,5' }, 'USD').estimate.modificationCostCents).toBeNull();
  });
});
