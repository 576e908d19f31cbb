/** The text of docs/openapi.yaml, as served at /api/docs/openapi.yaml and written by write-openapi.ts. */
import { openApiSpec } from './openapi-spec';
import { toYaml } from './to-yaml';

/** The YAML document with its provenance header. */
export function openApiYamlText(): string {
  return `# Assayer API (OpenAPI 3.1). Generated from server/docs/openapi-spec.ts; edit that file and run\n# npx tsx server/docs/write-openapi.ts\n${toYaml(openApiSpec())}`;
}
