import { validateXML } from 'xmllint-wasm';
import { GPX_1_0_XSD, GPX_1_1_XSD } from './schemas/gpx-schemas.js';

/** Largest GPX text validated against its schema; larger logs are read but not validated (a note says so). */
export const MAX_VALIDATED_CHARS = 64 * 1024 * 1024;

/** One schema problem, with the line xmllint reports it on. */
export interface GpxSchemaMessage {
  line: number;
  message: string;
}

/** The outcome of validating a GPX log against the published XSD of its version. */
export interface GpxValidation {
  /** `gpx-1.1`, `gpx-1.0`, or `none` when the version is unknown or the log too large. */
  schema: 'gpx-1.1' | 'gpx-1.0' | 'none';
  valid: boolean;
  messages: GpxSchemaMessage[];
}

/**
 * Validates GPX text against the vendored TopoGrafix XSD of its version (from the root's
 * `version` attribute or namespace) with xmllint compiled to WebAssembly; no network is used.
 * Asynchronous because xmllint runs on a worker. Never throws for bad input: problems come back
 * as messages with line numbers. Refuses (as a message) logs larger than `MAX_VALIDATED_CHARS`.
 */
export async function validateGpx(fileName: string, text: string): Promise<GpxValidation> {
  const head = text.slice(0, 4096);
  const schema = /GPX\/1\/1|version\s*=\s*["']1\.1["']/.test(head)
    ? 'gpx-1.1'
    : /GPX\/1\/0|version\s*=\s*["']1\.0["']/.test(head)
      ? 'gpx-1.0'
      : 'none';
  if (schema === 'none')
    return {
      schema,
      valid: false,
      messages: [{ line: 1, message: 'no GPX 1.0 or 1.1 namespace or version found; not validated' }],
    };
  if (text.length > MAX_VALIDATED_CHARS) {
    return {
      schema: 'none',
      valid: false,
      messages: [{ line: 1, message: `not validated: larger than ${MAX_VALIDATED_CHARS} characters` }],
    };
  }
  const safeName = `${fileName.replace(/[^A-Za-z0-9._-]/g, '_').replace(/^[-.]+/, '') || 'input'}.gpx`;
  try {
    const result = await validateXML({
      xml: [{ fileName: safeName, contents: text }],
      schema: [{ fileName: `${schema}.xsd`, contents: schema === 'gpx-1.1' ? GPX_1_1_XSD : GPX_1_0_XSD }],
      initialMemoryPages: 256,
      maxMemoryPages: 65536 / 8,
      // --nonet: never fetch anything a log points at
      modifyArguments: (args) => ['--nonet', ...args],
    });
    // xmllint prints a parser error as three lines (message, source excerpt, caret); keep the message
    const messages = result.errors
      .filter((e) => e.loc !== null)
      .map((e) => ({
        line: e.loc?.lineNumber ?? 0,
        message: e.message
          .replace(/^Schemas validity error : /, '')
          .replace(/^parser error : /, 'not well-formed: ')
          .trim(),
      }))
      .filter((m) => m.message !== '' && m.message !== '^');
    return { schema, valid: result.valid, messages };
  } catch (error) {
    return {
      schema,
      valid: false,
      messages: [
        { line: 0, message: `validation could not run: ${error instanceof Error ? error.message : String(error)}` },
      ],
    };
  }
}
