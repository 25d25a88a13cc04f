/**
 * Set-up form text to numbers and problems to fields. Expected numbers: NIST SP 811 (2008),
 * Appendix B.8, 1 psi = 6.894757 kPa.
 */
import { z } from 'zod';

import { ApiError } from '@/hooks/api/client';
import {
  convertNumberText,
  errorFor,
  fieldErrorFromServer,
  fieldErrorsFromZod,
  fieldTestID,
  numberText,
  optionalText,
  parseNumberText,
} from './formFields';
import { fromSI, toSI } from './unitChoices';

describe('parseNumberText', () => {
  it('reads plain decimals, signs, leading points and exponents, ignoring blanks around them', () => {
    expect(parseNumberText(' 12.5 ')).toBe(12.5);
    expect(parseNumberText('-3')).toBe(-3);
    expect(parseNumberText('+4.')).toBe(4);
    expect(parseNumberText('.5')).toBe(0.5);
    expect(parseNumberText('1e-3')).toBe(0.001);
    expect(parseNumberText('2.5E+2')).toBe(250);
  });

  it('gives undefined for an empty field, so an optional field is left out', () => {
    expect(parseNumberText('')).toBeUndefined();
    expect(parseNumberText('   ')).toBeUndefined();
  });

  it('gives NaN for a decimal comma or a thousands separator, so the schema names the field', () => {
    expect(parseNumberText('1,5')).toBeNaN();
    expect(parseNumberText('1,000')).toBeNaN();
  });

  it('gives NaN for a number with a unit or anything else JavaScript alone would take as a number', () => {
    expect(parseNumberText('12 mm')).toBeNaN();
    expect(parseNumberText('Infinity')).toBeNaN();
    expect(parseNumberText('0x10')).toBeNaN();
    expect(parseNumberText('.')).toBeNaN();
  });
});

describe('optionalText', () => {
  it('trims text and gives undefined for a blank one', () => {
    expect(optionalText('  Compressor station  ')).toBe('Compressor station');
    expect(optionalText(' ')).toBeUndefined();
  });
});

describe('numberText', () => {
  it('puts a number back into a field without float noise', () => {
    expect(numberText(0.1 + 0.2)).toBe('0.3');
    expect(numberText(101_325)).toBe('101325');
    expect(numberText(1e-7)).toBe('1e-7');
  });

  it('gives an empty field for a missing or non-finite number', () => {
    expect(numberText(undefined)).toBe('');
    expect(numberText(null)).toBe('');
    expect(numberText(Number.NaN)).toBe('');
  });
});

describe('convertNumberText', () => {
  it('keeps the quantity when the unit changes: 14.73 psia becomes 101.56 kPa (NIST SP 811: 1 psi = 6.894757 kPa)', () => {
    const kPa = convertNumberText('14.73', (psi) => fromSI(toSI(psi, 'psi'), 'kPa'));
    expect(Number(kPa)).toBeCloseTo(14.73 * 6.894757, 4);
  });

  it('leaves text that is not a number as it is', () => {
    expect(convertNumberText('', (v) => v * 2)).toBe('');
    expect(convertNumberText('lots', (v) => v * 2)).toBe('lots');
    expect(convertNumberText('1,5', (v) => v * 2)).toBe('1,5');
  });
});

describe('fieldErrorsFromZod', () => {
  const schema = z.object({
    name: z.string().min(1, 'is required'),
    element: z.object({ boreDiameterM: z.number().positive('must be > 0') }),
  });

  it('keys each problem by its field path, under the given prefix', () => {
    const parsed = schema.safeParse({ name: '', element: { boreDiameterM: -1 } });
    expect(parsed.success).toBe(false);
    if (parsed.success) return;
    expect(fieldErrorsFromZod(parsed.error)).toEqual({ name: 'is required', 'element.boreDiameterM': 'must be > 0' });
    expect(fieldErrorsFromZod(parsed.error, 'meterRun')).toEqual({
      'meterRun.name': 'is required',
      'meterRun.element.boreDiameterM': 'must be > 0',
    });
  });

  it('keeps the first problem of a field', () => {
    const twice = z
      .string()
      .min(3, 'too short')
      .regex(/^[a-z]+$/, 'letters only');
    const parsed = z.object({ tag: twice }).safeParse({ tag: '1' });
    if (parsed.success) throw new Error('expected a problem');
    expect(fieldErrorsFromZod(parsed.error)).toEqual({ tag: 'too short' });
  });

  it('puts a problem of the whole body under "body"', () => {
    const parsed = z.object({}).safeParse('text');
    if (parsed.success) throw new Error('expected a problem');
    expect(Object.keys(fieldErrorsFromZod(parsed.error))).toEqual(['body']);
  });
});

describe('fieldErrorFromServer', () => {
  it('drops the field path the server puts before its message', () => {
    const error = new ApiError(
      400,
      'invalid_body',
      'element.boreDiameterM: must be below pipeDiameterM',
      'element.boreDiameterM',
    );
    expect(fieldErrorFromServer(error)).toEqual({ 'element.boreDiameterM': 'must be below pipeDiameterM' });
  });

  it('keeps a message that does not start with the field path', () => {
    const error = new ApiError(409, 'conflict', 'That tag is taken.', 'tag');
    expect(fieldErrorFromServer(error)).toEqual({ tag: 'That tag is taken.' });
  });

  it('gives null when the server named no field, or the error is not the server’s', () => {
    expect(fieldErrorFromServer(new ApiError(500, 'internal', 'Something failed.'))).toBeNull();
    expect(fieldErrorFromServer(new Error('tag: taken'))).toBeNull();
  });
});

describe('errorFor', () => {
  const errors = { 'site.name': 'is required', 'fluid.composition.methane': 'mole fractions must be ≤ 1' };

  it('finds the problem of a field, or of a field under it', () => {
    expect(errorFor(errors, 'site.name')).toBe('is required');
    expect(errorFor(errors, 'fluid.composition')).toBe('mole fractions must be ≤ 1');
  });

  it('does not take a field whose name merely starts the same', () => {
    expect(errorFor(errors, 'fluid.comp')).toBeUndefined();
    expect(errorFor(errors, 'site')).toBe('is required');
    expect(errorFor(errors, 'site.code')).toBeUndefined();
  });
});

describe('fieldTestID', () => {
  it('joins the form prefix and the path with dashes', () => {
    expect(fieldTestID('meter-run', 'element.boreDiameterM')).toBe('meter-run-element-boreDiameterM');
  });
});
