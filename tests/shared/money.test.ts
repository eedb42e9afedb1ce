import Decimal from 'decimal.js';
import fc from 'fast-check';
import {
  allocateCents,
  centsToDecimalString,
  formatCents,
  formatCentsPlain,
  multiplyCents,
  parseCents,
  percentOfCents,
  splitCentsEvenly,
  sumCents,
} from '@shared/domain/money';

// An independent decimal.js constructor (library defaults, not the project's clone) used as the oracle.
const Oracle = Decimal.clone({ precision: 50 });

describe('parseCents', () => {
  it('when given plain and grouped amounts, then returns whole cents', () => {
    expect(parseCents('1234.56')).toBe(123456);
    expect(parseCents('1,234.56')).toBe(123456);
    expect(parseCents(' 12 ')).toBe(1200);
    expect(parseCents('.25')).toBe(25);
    expect(parseCents('-0.5')).toBe(-50);
    expect(parseCents('+7.1')).toBe(710);
    expect(parseCents('1.500')).toBe(150);
    expect(Object.is(parseCents('-0.00'), 0)).toBe(true);
  });

  it('when given more decimals than the currency has, then refuses rather than rounding', () => {
    expect(() => parseCents('1.505')).toThrow(/more than 2 decimal places/);
    // ISO 4217: JPY has no minor unit
    expect(parseCents('1234', 'JPY')).toBe(1234);
    expect(() => parseCents('12.5', 'JPY')).toThrow(/more than 0 decimal places/);
  });

  it('when the text is not an amount, then throws', () => {
    for (const bad of ['', 'abc', '1,23', '12,34.5', '1.2.3', '$5', '1e3', '-']) {
      expect(() => parseCents(bad)).toThrow(RangeError);
    }
    expect(() => parseCents('1', 'NOPE')).toThrow(/currency/);
  });
});

describe('formatCents', () => {
  it('when formatting US dollars, then shows sign, grouping and two decimals', () => {
    expect(formatCents(123456)).toBe('$1,234.56');
    expect(formatCents(5)).toBe('$0.05');
    expect(formatCents(0)).toBe('$0.00');
    expect(formatCents(-5)).toBe('-$0.05');
  });

  it('when the amount is near the largest safe integer, then no digit is lost to floating point', () => {
    expect(formatCents(9007199254740991)).toBe('$90,071,992,547,409.91');
    expect(centsToDecimalString(9007199254740991)).toBe('90071992547409.91');
    expect(formatCentsPlain(-123456789)).toBe('-1,234,567.89');
  });

  it('when another currency is given, then uses its sign and minor unit', () => {
    expect(formatCents(123456, 'EUR')).toBe('€1,234.56');
    expect(formatCents(1234, 'JPY')).toBe('¥1,234'); // ISO 4217: JPY has 0 decimals
  });

  it('when cents are not whole, then throws', () => {
    expect(() => formatCents(1.5)).toThrow(RangeError);
  });
});

describe('allocateCents', () => {
  it('when $100 is split three ways, then the first share takes the odd cent', () => {
    // Source: dinero.js 2.0.2 allocate($100, [1, 1, 1]) -> 33.34 / 33.33 / 33.33 (TRADE-FACTS 6.1, run locally)
    expect(allocateCents(10000, [1, 1, 1])).toEqual([3334, 3333, 3333]);
    expect(splitCentsEvenly(10000, 3)).toEqual([3334, 3333, 3333]);
  });

  it('when $50,000 is split 50/50, then each share is $25,000.00', () => {
    // Source: dinero.js 2.0.2 allocate($50,000, [50, 50]) -> 25,000.00 each (TRADE-FACTS 6.1)
    expect(allocateCents(5000000, [50, 50])).toEqual([2500000, 2500000]);
  });

  it('when remainders differ, then the largest remainders get the leftover cents', () => {
    // 100 over weights 1:2:3 -> exact 16.67, 33.33, 50.00 -> floors 16, 33, 50 (99); largest remainder is share 0
    expect(allocateCents(100, [1, 2, 3])).toEqual([17, 33, 50]);
    // decimal weights are exact: 0.1 + 0.2 is 0.3 here, not 0.30000000000000004
    expect(allocateCents(100, ['0.1', '0.2'])).toEqual([33, 67]);
  });

  it('when the total is negative, then every share is negative and they still add up', () => {
    expect(allocateCents(-10000, [1, 1, 1])).toEqual([-3334, -3333, -3333]);
  });

  it('when a weight is zero, then that share gets nothing', () => {
    expect(allocateCents(101, [0, 1, 1])).toEqual([0, 51, 50]);
  });

  it('when weights are empty, negative or all zero, then throws', () => {
    expect(() => allocateCents(100, [])).toThrow(RangeError);
    expect(() => allocateCents(100, [1, -1])).toThrow(RangeError);
    expect(() => allocateCents(100, [0, 0])).toThrow(RangeError);
    expect(() => splitCentsEvenly(100, 0)).toThrow(RangeError);
  });
});

describe('multiplyCents', () => {
  it('when the product ends in exactly half a cent, then rounds half-up (away from zero)', () => {
    expect(multiplyCents(1, '0.5')).toBe(1);
    expect(multiplyCents(5, '0.5')).toBe(3); // banker's rounding would give 2
    expect(multiplyCents(-5, '0.5')).toBe(-3);
    expect(multiplyCents(3, '0.5')).toBe(2);
    expect(multiplyCents(1000, '0.3333')).toBe(333);
  });

  it('when taking a percentage, then rounds half-up to the cent', () => {
    expect(percentOfCents(1000, '6.5')).toBe(65);
    expect(percentOfCents(390, '2.5')).toBe(10); // 9.75 -> 10
    expect(percentOfCents(30, '5')).toBe(2); // 1.5 -> 2
  });

  it('when the ratio is not a number, then throws', () => {
    expect(() => multiplyCents(100, 'x')).toThrow(RangeError);
    expect(() => multiplyCents(100, Infinity)).toThrow(RangeError);
  });
});

describe('sumCents', () => {
  it('when adding whole cents, then returns the sum; fractions are refused', () => {
    expect(sumCents([1, 2, 3])).toBe(6);
    expect(() => sumCents([1, 0.5])).toThrow(RangeError);
  });
});

describe('money properties (fast-check)', () => {
  const total = fc.integer({ min: -1_000_000_000_000, max: 1_000_000_000_000 });
  const weights = fc
    .array(fc.integer({ min: 0, max: 1_000_000 }), { minLength: 1, maxLength: 12 })
    .filter((ws) => ws.some((w) => w > 0));
  const ratio = fc
    .tuple(fc.integer({ min: -1_000_000, max: 1_000_000 }), fc.integer({ min: 2, max: 6 }))
    .map(([n, places]) => new Oracle(n).div(new Oracle(10).pow(places)).toString());

  it('when any total is allocated over any weights, then the shares add back to the total exactly', () => {
    fc.assert(
      fc.property(total, weights, (t, ws) => {
        const shares = allocateCents(t, ws);
        expect(shares.reduce((a, b) => a + b, 0)).toBe(t);
        const sum = ws.reduce((a, b) => a + b, 0);
        shares.forEach((s, i) => {
          // each share is within one cent of its exact proportional share (decimal.js oracle)
          const exact = new Oracle(t).times(ws[i]).div(sum);
          expect(exact.minus(s).abs().lt(1)).toBe(true);
          expect(Number.isSafeInteger(s)).toBe(true);
        });
      }),
    );
  });

  it('when cents are multiplied by a ratio, then the result is the decimal.js half-up rounding of the exact product', () => {
    fc.assert(
      fc.property(fc.integer({ min: -100_000_000_000, max: 100_000_000_000 }), ratio, (c, r) => {
        const got = multiplyCents(c, r);
        // Oracle: decimal.js with ROUND_HALF_UP (ties away from zero), computed independently
        const expected = new Oracle(c).times(r).toDecimalPlaces(0, Decimal.ROUND_HALF_UP).toNumber();
        expect(got).toBe(expected === 0 ? 0 : expected);
        expect(new Oracle(c).times(r).minus(got).abs().lte('0.5')).toBe(true);
      }),
    );
  });

  it('when a rounded amount is then allocated, then no cent is lost or gained on the way', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000_000 }), ratio, weights, (c, r, ws) => {
        const rounded = multiplyCents(c, r);
        expect(allocateCents(rounded, ws).reduce((a, b) => a + b, 0)).toBe(rounded);
      }),
    );
  });

  it('when cents are written out and parsed back, then the same cents come back', () => {
    fc.assert(
      fc.property(fc.integer({ min: -Number.MAX_SAFE_INTEGER, max: Number.MAX_SAFE_INTEGER }), (c) => {
        expect(parseCents(centsToDecimalString(c))).toBe(c === 0 ? 0 : c);
        expect(parseCents(formatCentsPlain(c))).toBe(c === 0 ? 0 : c);
      }),
    );
  });
});
