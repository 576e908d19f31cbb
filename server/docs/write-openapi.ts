/** Writes docs/openapi.yaml from the description in openapi-spec.ts: `npx tsx server/docs/write-openapi.ts`. */
import fs from 'node:fs';
import path from 'node:path';
import { openApiYamlText } from './openapi-yaml';

const target = path.resolve('docs/openapi.yaml');
fs.writeFileSync(target, openApiYamlText());
console.log(`wrote ${path.relative(process.cwd(), target)}`);
