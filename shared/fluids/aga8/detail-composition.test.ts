import { DETAIL_COMPONENTS } from './detail-constants';
import { lookUpComponentName } from './detail-composition';

/**
 * The one lookup every boundary uses for gas component names. The 21 names are the components of
 * AGA Report No. 8 Part 1 (2017) DETAIL, Table 1 [mem]; the spellings are the trade's usual ones.
 */
describe('lookUpComponentName', () => {
  it.each([
    ['carbon-dioxide', 'carbon-dioxide'],
    ['carbon dioxide', 'carbon-dioxide'],
    ['Carbon Dioxide', 'carbon-dioxide'],
    ['CO2', 'carbon-dioxide'],
    ['i-butane', 'isobutane'],
    ['N2', 'nitrogen'],
  ])('knows %p as %p', (given, canonical) => {
    expect(lookUpComponentName(given)).toEqual({ known: true, canonical });
  });

  it('knows every DETAIL component by its canonical name', () => {
    for (const name of DETAIL_COMPONENTS) expect(lookUpComponentName(name)).toEqual({ known: true, canonical: name });
  });

  it('lists close known names for a misspelling, nearest first, with the name an accepted spelling stands for', () => {
    const typo = lookUpComponentName('carbon dioxid');
    expect(typo.known).toBe(false);
    expect(!typo.known && typo.closeMatches[0]).toBe('carbon-dioxide');
    expect(lookUpComponentName('nitrogn')).toEqual({ known: false, canonical: 'nitrogn', closeMatches: ['nitrogen'] });
    // "i-butan" is 1 edit from the accepted spelling "i-butane", 2 from "n-butane".
    expect(lookUpComponentName('i-butan')).toMatchObject({
      known: false,
      closeMatches: ['i-butane (isobutane)', 'n-butane'],
    });
  });

  it('lists nothing for a name far from every component', () => {
    expect(lookUpComponentName('unobtainium')).toEqual({ known: false, canonical: 'unobtainium', closeMatches: [] });
  });
});
