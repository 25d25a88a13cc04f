/**
 * Contrast is checked with WCAG 2.1's own definitions of relative luminance (sRGB) and contrast
 * ratio, (L1 + 0.05) / (L2 + 0.05): at least 7:1 for body text (SC 1.4.6, AAA) and 4.5:1 for
 * other text (SC 1.4.3, AA). Touch targets: WCAG 2.1 SC 2.5.5 asks for 44 × 44 CSS px.
 */
import { alarmStyle, breakpoints, colors, layout } from './theme';

/** WCAG 2.1, "relative luminance". */
function relativeLuminance(hex: string): number {
  const channel = (value: number) => {
    const c = value / 255;
    return c <= 0.03928 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
  };
  const n = parseInt(hex.slice(1), 16);
  return 0.2126 * channel((n >> 16) & 255) + 0.7152 * channel((n >> 8) & 255) + 0.0722 * channel(n & 255);
}

/** WCAG 2.1, "contrast ratio". */
function contrast(a: string, b: string): number {
  const [light, dark] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x);
  return (light + 0.05) / (dark + 0.05);
}

describe('the WCAG helpers', () => {
  it('give black on white the largest contrast, 21:1, and a colour on itself 1:1', () => {
    expect(contrast('#000000', '#FFFFFF')).toBeCloseTo(21, 10);
    expect(contrast('#6B727A', '#6B727A')).toBeCloseTo(1, 10);
  });
});

describe('text contrast', () => {
  it('keeps body text at 7:1 or more on the surface and the background (AAA)', () => {
    expect(contrast(colors.text, colors.surface)).toBeGreaterThanOrEqual(7);
    expect(contrast(colors.text, colors.background)).toBeGreaterThanOrEqual(7);
    expect(contrast(colors.text, colors.inputBackground)).toBeGreaterThanOrEqual(7);
  });

  it('keeps muted text at 4.5:1 or more on the surface and the background (AA)', () => {
    expect(contrast(colors.textMuted, colors.surface)).toBeGreaterThanOrEqual(4.5);
    expect(contrast(colors.textMuted, colors.background)).toBeGreaterThanOrEqual(4.5);
  });

  it('keeps navigation and action text at 4.5:1 or more on their fills', () => {
    expect(contrast(colors.navText, colors.navBackground)).toBeGreaterThanOrEqual(4.5);
    expect(contrast(colors.navTextMuted, colors.navBackground)).toBeGreaterThanOrEqual(4.5);
    expect(contrast(colors.navText, colors.navSelected)).toBeGreaterThanOrEqual(4.5);
    expect(contrast(colors.actionText, colors.actionFill)).toBeGreaterThanOrEqual(4.5);
    expect(contrast(colors.actionText, colors.actionFillPressed)).toBeGreaterThanOrEqual(4.5);
  });
});

describe('alarmStyle', () => {
  it.each(Object.entries(alarmStyle))(
    'keeps %s alarm text at 4.5:1 or more on its tint and on the surface',
    (_, style) => {
      expect(contrast(style.color, style.surface)).toBeGreaterThanOrEqual(4.5);
      expect(contrast(style.color, colors.surface)).toBeGreaterThanOrEqual(4.5);
    },
  );

  it('gives each priority its own shape and label, so colour is never the only sign', () => {
    const styles = Object.values(alarmStyle);
    expect(new Set(styles.map((s) => s.shape)).size).toBe(styles.length);
    expect(styles.map((s) => s.label)).toEqual(['High', 'Medium', 'Low']);
  });
});

describe('layout', () => {
  it('makes touch targets at least 44 px (WCAG 2.1 SC 2.5.5)', () => {
    expect(layout.touchTarget).toBeGreaterThanOrEqual(44);
  });

  it('orders the breakpoints phone, tablet, wide', () => {
    expect(breakpoints.phone).toBeLessThan(breakpoints.tablet);
    expect(breakpoints.tablet).toBeLessThan(breakpoints.wide);
  });
});
