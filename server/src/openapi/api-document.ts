import $RefParser from '@apidevtools/json-schema-ref-parser';
import type { OpenAPIV3_1 } from 'openapi-types';

const bundles = new Map<string, Promise<OpenAPIV3_1.Document>>();

/** The OpenAPI document with its split files bundled into one object (loaded once per path, then cached). */
export function loadApiDocument(path: string): Promise<OpenAPIV3_1.Document> {
  let bundle = bundles.get(path);
  if (!bundle) {
    bundle = $RefParser.bundle(path).then((doc) => doc as unknown as OpenAPIV3_1.Document);
    bundles.set(path, bundle);
    bundle.catch(() => bundles.delete(path));
  }
  return bundle;
}
