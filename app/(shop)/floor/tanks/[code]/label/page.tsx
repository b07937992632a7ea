import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import QRCode from 'qrcode';
import { formatBathValue } from '@/components/bath/bath-value';
import { requirePageUser } from '@/lib/auth/current-user';
import { appUrl } from '@/lib/email/mailer';
import { getFloorTank } from '@/lib/bath/floor-queries';
import { PrintButton } from './print-button';

export const metadata: Metadata = { title: 'Tank label' };

// Printing hides everything but the label (the navigation included).
const PRINT_CSS = `@media print { body * { visibility: hidden !important; } #tank-label, #tank-label * { visibility: visible !important; } #tank-label { position: absolute; left: 0; top: 0; } }`;

export default async function TankLabelPage({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  const user = await requirePageUser('bath.log', `/floor/tanks/${code}/label`);
  const tank = await getFloorTank({ code });
  if (!tank) notFound();
  const url = appUrl(`/floor/tanks/${tank.code}`);
  // Error correction level M survives a splash or a scratch on a laminated label.
  const svg = await QRCode.toString(url, { type: 'svg', errorCorrectionLevel: 'M', margin: 2 });
  return (
    <div className="flex flex-col items-start gap-4">
      <style>{PRINT_CSS}</style>
      <div id="tank-label" className="flex w-[90mm] flex-col items-center gap-2 rounded-md border-2 border-ink bg-white p-4 text-center text-ink">
        <p className="text-3xl font-bold tracking-wide">{tank.code}</p>
        <p className="text-lg font-semibold">{tank.name}</p>
        <div className="w-[60mm]" role="img" aria-label={`QR code for ${url}`} dangerouslySetInnerHTML={{ __html: svg }} />
        <p className="text-sm">{tank.templateName} · {formatBathValue(tank.volumeL, 'L', user.unitSystem)}</p>
        <p className="break-all text-xs">{url}</p>
        <p className="text-xs">Scan to log analyses, additions and meter readings for this tank.</p>
      </div>
      <PrintButton />
    </div>
  );
}
