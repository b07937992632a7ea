// Renders one packing slip in a plain Node process (JSON on stdin, base64 PDF on stdout), for
// callers running under the react-server condition (the seed), whose React cannot drive @react-pdf.
import { renderPackingSlipPdf } from './packing-slip-pdf';

async function main(): Promise<void> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  const pdf = await renderPackingSlipPdf(JSON.parse(Buffer.concat(chunks).toString('utf8')));
  process.stdout.write(pdf.toString('base64'));
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exitCode = 1;
});
