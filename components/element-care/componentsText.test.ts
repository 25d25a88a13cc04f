import { parseComponentsText } from './componentsText';

describe('parseComponentsText', () => {
  it('reads one component a line with spaces, a colon or a tab, a decimal comma and a % sign', () => {
    expect(parseComponentsText('methane 91.37\nCO2: 1.12\n\nn-butane\t0,28 %\ncarbon dioxide = 0.5')).toEqual({
      components: { methane: 91.37, CO2: 1.12, 'n-butane': 0.28, 'carbon dioxide': 0.5 },
    });
  });

  it('names the line without a number and a component given twice', () => {
    expect(parseComponentsText('methane 0.9\nethane')).toEqual({
      problem: 'line 2: write a component name, then its fraction or mol % (got "ethane")',
    });
    expect(parseComponentsText('methane 0.9\nmethane 0.1')).toEqual({ problem: 'line 2: methane is listed twice' });
  });
});
