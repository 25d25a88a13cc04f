import { csvField, csvText } from './csv-text';

// Expected texts follow RFC 4180 §2 (rules 4–7): CRLF between records, fields with commas, quotes
// or line breaks enclosed in double quotes, and a double quote inside a field written twice.
describe('csvText', () => {
  it('writes plain fields as they are, records ended by CRLF, the header first', () => {
    expect(csvText(['a', 'b'], [['x', 1.5]])).toBe('a,b\r\nx,1.5\r\n');
  });

  it('quotes a field holding a comma, a quote, a CR or an LF and doubles each quote', () => {
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField('cr\rhere')).toBe('"cr\rhere"');
  });

  it('leaves spaces as data and writes null and undefined as empty fields', () => {
    expect(csvText(['a', 'b', 'c'], [[' padded ', null, undefined]])).toBe('a,b,c\r\n padded ,,\r\n');
  });
});
