import { estimateMethodText } from './estimateMethod';

describe('estimateMethodText', () => {
  it('names the sales meter, the other wells and the allowance for sales minus the other wells', () => {
    const basis = {
      salesMeter: { meterRunId: '3', tag: 'S-1' },
      otherWells: [
        { meterRunId: '2', tag: 'W-2' },
        { meterRunId: '4', tag: 'W-4' },
      ],
      allowance: { percent: 1, dailyM3: null },
    };
    expect(estimateMethodText('sales-minus-other-wells', basis)).toBe(
      'From the sales meter S-1 minus W-2, W-4 over the same hours, with the allowance of 1 % of the inlet.',
    );
  });

  it('says the previous days for the fallback method, and names an unknown method as it is', () => {
    expect(estimateMethodText('previous-days', {})).toBe('The mean of the same hours over the previous 7 days.');
    expect(estimateMethodText('other', null)).toBe('Method: other.');
  });
});
