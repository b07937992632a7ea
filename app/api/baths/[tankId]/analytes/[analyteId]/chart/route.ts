// GET /api/baths/<tankId>/analytes/<analyteId>/chart?from&to[&limits=baseline][&format=csv] — staff who may read
// bath records (bath.read): the analyte's individuals chart data, in the reader's units.
import { CHART_DAY, chartCsv, getChartData, parseChartRange } from '@/lib/bath/chart';
import { chartAnswer } from '@/lib/bath/chart-cache';
import { AppError } from '@/lib/errors';
import { withPermission } from '@/lib/http';
import { conditionalByValidator, conditionalJsonText } from '@/lib/http-etag';

export const dynamic = 'force-dynamic';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const GET = withPermission<{ tankId: string; analyteId: string }>('bath.read', async (req, user, ctx) => {
  const { tankId, analyteId } = await ctx.params;
  if (!UUID.test(tankId) || !UUID.test(analyteId)) throw new AppError('NOT_FOUND', 'That analyte does not belong to this tank.');
  const params = new URL(req.url).searchParams;
  const range = parseChartRange(params.get('from'), params.get('to'));
  const basis = params.get('limits') === 'baseline' ? 'baseline' : 'all';
  if (params.get('format') !== 'csv') {
    // A range of whole days (what the chart screen asks for) is stored once per change of its
    // analyte (lib/bath/chart-cache.ts); any other range is worked out each time.
    const days = [params.get('from'), params.get('to')].every((d) => d !== null && CHART_DAY.test(d));
    if (days) {
      const answer = await chartAnswer(tankId, analyteId, range, user.unitSystem, basis);
      return conditionalByValidator(req, answer.etag, async () => answer.body);
    }
    return conditionalJsonText(req, JSON.stringify(await getChartData(tankId, analyteId, range, user.unitSystem, undefined, basis)));
  }
  // The CSV holds every reading.
  const data = await getChartData(tankId, analyteId, range, user.unitSystem, undefined, basis, true);
  const name = `${data.analyte.tankCode}-${data.analyte.key}-${range.from.toISOString().slice(0, 10)}.csv`;
  return new Response(chartCsv(data), {
    headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="${name}"`, 'cache-control': 'no-store' },
  });
});
