// GET /api/v1/bath-analyses — analyses, newest first (staff with bath.read)
// POST /api/v1/bath-analyses — a laboratory's result (bath.log); judged and alerted as any analysis
import { after } from 'next/server';
import { apiJson, apiRoute, parseQuery } from '@/lib/api/route';
import { notifyNewAlerts } from '@/lib/bath/floor-entries';
import { logAnalysis } from '@/lib/bath/log-analysis';
import { getAnalysis, listAnalyses } from '@/lib/api/v1/resources';
import { analysis, analysisIn, analysisListQuery, analysisLogged, pageOf } from '@/lib/api/v1/schemas';
import { readJson } from '@/lib/http';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('bath.read', async (req) => apiJson(pageOf(analysis, 'Analysis'), await listAnalyses(parseQuery(req, analysisListQuery))));

export const POST = apiRoute('bath.log', async (req, user) => {
  const body = analysisIn.parse(await readJson(req));
  const logged = await logAnalysis(user, {
    key: `api:${body.key}`,
    tankId: body.tankId,
    analyteId: body.analyteId,
    inputs: {},
    reportedValue: body.value,
    takenAt: new Date(body.takenAt),
    note: body.note ?? 'Outside laboratory (API)',
    source: 'lab',
  });
  if (logged.newAlertIds.length) after(() => notifyNewAlerts(logged.newAlertIds));
  return apiJson(
    analysisLogged,
    { analysis: await getAnalysis(logged.analysis.id), duplicate: logged.duplicate, verdict: logged.verdict, message: logged.message },
    logged.duplicate ? 200 : 201,
  );
});
