/**
 * `npm run --silent flow-calc < case.json`: reads a flow calculation case (DESIGN.md) on
 * stdin, prints the result JSON (2-space indent) on stdout and exits 0; a bad case (invalid
 * JSON, schema failure, engine error) prints { "error": { code, message, field } } and exits 2.
 */
import { calculateFlow } from '../../shared/flow/calculate-flow';

function readStdin(): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    process.stdin.on('data', (c: Buffer) => chunks.push(c));
    process.stdin.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    process.stdin.on('error', reject);
  });
}

function fail(message: string, field: string | null = null): void {
  process.stdout.write(JSON.stringify({ error: { code: 'invalid_case', message, field } }, null, 2) + '\n');
  process.exitCode = 2;
}

async function main(): Promise<void> {
  const text = await readStdin();
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    fail(`flow-calc: stdin is not valid JSON (${error instanceof Error ? error.message : String(error)})`);
    return;
  }
  const calculation = calculateFlow(value);
  if (calculation.ok) {
    process.stdout.write(JSON.stringify(calculation.result, null, 2) + '\n');
    process.exitCode = 0;
  } else {
    process.stdout.write(JSON.stringify({ error: calculation.error }, null, 2) + '\n');
    process.exitCode = 2;
  }
}

main().catch((error: unknown) => fail(`flow-calc: ${error instanceof Error ? error.message : String(error)}`));
