// The OpenAPI 3.1 document of /api/v1, generated from the schemas the endpoints parse with
// (lib/api/v1/schemas.ts) by @asteasolutions/zod-to-openapi. Served at /api/v1/openapi.json.
import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { estimateRequestSchema } from '@/lib/estimating/api';
import * as S from './schemas';

export const API_VERSION = '1.0.0';

type Doc = ReturnType<OpenApiGeneratorV31['generateDocument']>;

const errors = {
  400: { description: 'A value is missing or not valid; `error.fields` names each one.', content: { 'application/json': { schema: S.apiError } } },
  401: { description: 'No valid API token or session.', content: { 'application/json': { schema: S.apiError } } },
  403: { description: 'The token’s role may not do this.', content: { 'application/json': { schema: S.apiError } } },
  429: { description: 'Too many requests for this token this minute; see Retry-After.', content: { 'application/json': { schema: S.apiError } } },
} as const;

function list(path: string, tag: string, summary: string, query: z.ZodObject, item: z.ZodType, name: string, who: string) {
  return {
    method: 'get' as const,
    path,
    tags: [tag],
    summary,
    description: `${who} Pages by key: pass the answer’s \`next\` as \`after\`.`,
    request: { query },
    responses: { 200: { description: 'One page.', content: { 'application/json': { schema: S.pageOf(item, name) } } }, ...errors },
  };
}

export function openApiDocument(): Doc {
  const r = new OpenAPIRegistry();
  r.registerComponent('securitySchemes', 'token', { type: 'http', scheme: 'bearer', description: 'An API token made by the owner (Settings › API tokens) or a customer’s administrator (portal › API tokens).' });
  const customerToo = 'Staff see every customer; a customer’s token sees only its own company’s records.';
  r.registerPath(list('/api/v1/parts', 'Parts', 'List parts', S.pageQuery, S.part, 'Part', customerToo));
  r.registerPath(list('/api/v1/quotes', 'Quotes', 'List quotes', S.quoteListQuery, S.quote, 'Quote', `${customerToo} Customers never see drafts.`));
  r.registerPath(list('/api/v1/work-orders', 'Work orders', 'List work orders with planned and actual dates', S.workOrderListQuery, S.workOrder, 'WorkOrder', customerToo));
  r.registerPath(list('/api/v1/shipments', 'Shipments', 'List shipments', S.pageQuery, S.shipment, 'Shipment', customerToo));
  r.registerPath(list('/api/v1/certificates', 'Certificates', 'List certificates of conformance', S.pageQuery, S.certificate, 'Certificate', customerToo));
  r.registerPath({
    method: 'get',
    path: '/api/v1/certificates/{certificateId}/pdf',
    tags: ['Certificates'],
    summary: 'A certificate’s PDF',
    request: { params: z.object({ certificateId: z.uuid() }) },
    responses: { 200: { description: 'The signed PDF.', content: { 'application/pdf': { schema: z.string().meta({ format: 'binary' }) } } }, 404: { description: 'No such certificate for this caller.', content: { 'application/json': { schema: S.apiError } } }, ...errors },
  });
  r.registerPath(list('/api/v1/invoices', 'Invoices', 'List invoices', S.pageQuery, S.invoice, 'Invoice', 'The owner sees every customer; a customer’s token only its own company’s invoices.'));
  r.registerPath(list('/api/v1/bath-analyses', 'Bath analyses', 'List bath analyses, newest first', S.analysisListQuery, S.analysis, 'Analysis', 'Staff tokens only.'));
  r.registerPath({
    method: 'post',
    path: '/api/v1/bath-analyses',
    tags: ['Bath analyses'],
    summary: 'Post a laboratory result',
    description: 'Judged against the bath’s limits and control rules like any analysis; alerts go out as usual. Roles that may log analyses (plater, supervisor, owner).',
    request: { body: { content: { 'application/json': { schema: S.analysisIn } } } },
    responses: {
      201: { description: 'Stored.', content: { 'application/json': { schema: S.analysisLogged } } },
      200: { description: 'This key was stored before; the stored analysis.', content: { 'application/json': { schema: S.analysisLogged } } },
      ...errors,
    },
  });
  r.registerPath({
    method: 'post',
    path: '/api/v1/plating/estimate',
    tags: ['Estimating'],
    summary: 'Faraday’s-law estimate for a plating job',
    description: 'Office roles. See the README’s API section for a worked request.',
    request: { body: { content: { 'application/json': { schema: estimateRequestSchema } } } },
    responses: { 200: { description: 'The estimate.', content: { 'application/json': { schema: z.record(z.string(), z.unknown()) } } }, ...errors },
  });
  return new OpenApiGeneratorV31(r.definitions).generateDocument({
    openapi: '3.1.0',
    info: { title: 'Ampwright API', version: API_VERSION, description: 'Parts, quotes, work orders, shipments, certificates, invoices and bath analyses of an electroplating job shop.' },
    security: [{ token: [] }],
  });
}
