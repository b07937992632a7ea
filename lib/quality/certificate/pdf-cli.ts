// Renders one certificate PDF in a plain Node process: reads the content as JSON on stdin and
// writes the PDF, base64-encoded, to stdout. Used by renderCertificatePdf when the calling process
// runs under the "react-server" condition (the seed script), whose React cannot drive @react-pdf.
import { renderCertificatePdf } from './pdf';

async function main(): Promise<void> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  const pdf = await renderCertificatePdf(JSON.parse(Buffer.concat(chunks).toString('utf8')));
  process.stdout.write(pdf.toString('base64'));
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exitCode = 1;
});
