// POST /api/v1/plating/estimate — any signed-in staff with plating.estimate (README "API").
import { NextResponse } from 'next/server';
import { estimateFromRequest } from '@/lib/estimating/api';
import { apiRoute } from '@/lib/api/route';
import { readJson } from '@/lib/http';

export const POST = apiRoute('plating.estimate', async (req, user) => {
  const body = await readJson(req);
  return NextResponse.json(estimateFromRequest(body, user.unitSystem));
});
