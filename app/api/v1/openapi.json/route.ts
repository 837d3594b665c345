import { openApiDocument } from '@/server/openapi'

/** The OpenAPI 3.1 document of API v1, generated from the zod schemas the routes validate with. */
export function GET() {
  return Response.json(openApiDocument())
}
