/**
 * A fragment of the OpenAPI 3.1 document: each domain exports its paths and
 * schemas, and api/src/http/openapi.ts assembles them. `x-roles` on an
 * operation lists the roles it requires (absent: any signed-in user;
 * `x-public: true`: no session needed); the access tests are generated from it.
 */
export interface OpenApiFragment {
  paths: Record<string, Record<string, unknown>>;
  schemas?: Record<string, unknown>;
}
