/** Expected values: NIST SP 811 (2008), Appendix B.8, 1 in = 0.0254 m exactly. */
import { draftFromLine, emptyLineDraft, lineFieldLabels, lineFromDraft } from './lineDraft';

describe('lineFromDraft', () => {
  it('sends nothing but the flow direction for an empty draft', () => {
    expect(lineFromDraft(emptyLineDraft)).toEqual({ bidirectional: false });
  });

  it('sends the inside diameter in metres, straight lengths in diameters and trimmed text', () => {
    const line = lineFromDraft({
      ...emptyLineDraft,
      lengthUnit: 'in',
      insideDiameter: '6.065',
      nominalSize: ' NPS 6 ',
      schedule: '40',
      upstreamStraightLengthD: '44',
      downstreamStraightLengthD: '8',
      installDate: '2019-05-14',
      expectedServiceLifeYears: '25',
      bidirectional: 'yes',
    });
    expect(line).toEqual({
      insideDiameterM: expect.any(Number),
      nominalSize: 'NPS 6',
      schedule: '40',
      upstreamStraightLengthD: 44,
      downstreamStraightLengthD: 8,
      installDate: '2019-05-14',
      expectedServiceLifeYears: 25,
      bidirectional: true,
    });
    expect(line.insideDiameterM).toBeCloseTo(6.065 * 0.0254, 12);
  });

  it('leaves blank fields out rather than sending them empty', () => {
    expect(Object.keys(lineFromDraft({ ...emptyLineDraft, schedule: '   ', approvals: '' }))).toEqual([
      'bidirectional',
    ]);
  });

  it('sends a number it cannot read as NaN, for the schema to name', () => {
    expect(lineFromDraft({ ...emptyLineDraft, upstreamStraightLengthD: '44D' }).upstreamStraightLengthD).toBeNaN();
  });
});

describe('draftFromLine', () => {
  it('shows stored line data in the form, the inside diameter in the chosen unit', () => {
    const draft = draftFromLine(
      { insideDiameterM: 0.154051, nominalSize: 'NPS 6', upstreamStraightLengthD: 44, bidirectional: true },
      'in',
    );
    expect(draft).toMatchObject({
      lengthUnit: 'in',
      insideDiameter: '6.065',
      nominalSize: 'NPS 6',
      upstreamStraightLengthD: '44',
      downstreamStraightLengthD: '',
      bidirectional: 'yes',
    });
  });

  it('ignores fields of the wrong type, as a newer server might send', () => {
    expect(draftFromLine({ insideDiameterM: '6 in', schedule: 40, bidirectional: 'yes' }, 'mm')).toEqual({
      ...emptyLineDraft,
      lengthUnit: 'mm',
    });
  });

  it('gives back the same line when read again', () => {
    const line = {
      insideDiameterM: 0.1023,
      flangeClass: 'ASME 600',
      expectedServiceLifeYears: 30,
      bidirectional: false,
    };
    expect(lineFromDraft(draftFromLine(line, 'mm'))).toEqual(line);
  });
});

describe('lineFieldLabels', () => {
  it('has a label for every field the draft sends', () => {
    const sent = lineFromDraft({
      ...emptyLineDraft,
      insideDiameter: '1',
      nominalSize: 'a',
      schedule: 'a',
      flangeClass: 'a',
      pipeMaterial: 'a',
      elementMaterial: 'a',
      upstreamStraightLengthD: '1',
      downstreamStraightLengthD: '1',
      approvals: 'a',
      installDate: 'a',
      expectedServiceLifeYears: '1',
    });
    for (const key of Object.keys(sent)) expect(lineFieldLabels[`line.${key}`]).toEqual(expect.any(String));
  });
});
