import { breakpointForWidth } from './breakpointForWidth';

describe('breakpointForWidth', () => {
  it('calls a 390 px phone a phone, and anything narrower than 768 px', () => {
    expect(breakpointForWidth(390)).toBe('phone');
    expect(breakpointForWidth(0)).toBe('phone');
    expect(breakpointForWidth(767)).toBe('phone');
  });

  it('calls 768 px up to 1023 px a tablet, and 1024 px or more wide', () => {
    expect(breakpointForWidth(768)).toBe('tablet');
    expect(breakpointForWidth(1023)).toBe('tablet');
    expect(breakpointForWidth(1024)).toBe('wide');
    expect(breakpointForWidth(2560)).toBe('wide');
  });
});
