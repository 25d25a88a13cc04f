/**
 * A laboratory's components as typed in a form, one a line: a name, then its mole fraction or
 * mol % ("methane 91.37", "CO2: 1.12", "n-butane\t0.28"). The server checks names and the sum.
 */
export function parseComponentsText(text: string): { components: Record<string, number> } | { problem: string } {
  const components: Record<string, number> = {};
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i].trim();
    if (line === '') continue;
    const match = /^(.+?)[\s:=,;]+([+-]?(?:\d+[.,]?\d*|[.,]\d+)(?:[eE][+-]?\d+)?)\s*%?$/.exec(line);
    if (!match) return { problem: `line ${i + 1}: write a component name, then its fraction or mol % (got "${line}")` };
    const name = match[1].trim();
    if (name in components) return { problem: `line ${i + 1}: ${name} is listed twice` };
    components[name] = Number(match[2].replace(',', '.'));
  }
  if (Object.keys(components).length === 0) return { problem: 'write at least one component' };
  return { components };
}
