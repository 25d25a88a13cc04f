import { budgetRows } from './uncertaintyBudget';

describe('budgetRows', () => {
  it('lists the terms largest share first, in words, with their sources', () => {
    const rows = budgetRows([
      { term: 'differentialPressure', percent: 0.09375, source: 'DP transmitter' },
      { term: 'dischargeCoefficient', percent: 0.5, source: 'ISO 5167-2:2003 §5.3.3.1' },
    ]);
    expect(rows.map((r) => r.key)).toEqual(['dischargeCoefficient', 'differentialPressure']);
    expect(rows[0]).toMatchObject({ label: 'Discharge coefficient C', source: 'ISO 5167-2:2003 §5.3.3.1' });
    expect(rows[0].share).toMatch(/0\.5/);
  });

  it('gives no rows for a record stored before budgets were kept', () => {
    expect(budgetRows(null)).toEqual([]);
    expect(budgetRows(undefined)).toEqual([]);
  });

  it('keeps a term it has no words for under its own name', () => {
    expect(budgetRows([{ term: 'somethingNew', percent: 0.1, source: 's' }])[0].label).toBe('somethingNew');
  });
});
