// GET /api/v1/openapi.json — the API's OpenAPI 3.1 document, generated from its zod schemas; public
import { openApiDocument } from '@/lib/api/v1/openapi';

export const dynamic = 'force-static';

export function GET(): Response {
  return Response.json(openApiDocument());
}
