import type { Rejection } from '../model/rejection.js';

/** How far into an XML log to look for a DOCTYPE: it may only come before the root element. */
const PROLOG_SCAN_CHARS = 65_536;

/**
 * Looks at an XML log's prolog before any parser sees it and refuses a DOCTYPE (internal entity
 * declarations can expand exponentially, "billion laughs"; external ones would name files or URLs,
 * which Leadline never fetches). Returns the `forbidden-xml-construct` rejection, or `undefined`.
 */
export function findForbiddenXml(fileName: string, text: string): Rejection | undefined {
  const head = text.slice(0, PROLOG_SCAN_CHARS);
  const doctype = /<!DOCTYPE/i.exec(head);
  const entity = /<!ENTITY/i.exec(head);
  const hit = doctype ?? entity;
  if (hit === null) return undefined;
  const line = head.slice(0, hit.index).split('\n').length;
  const external = /<!DOCTYPE[^>[]*\b(SYSTEM|PUBLIC)\b/i.test(head) || /<!ENTITY[^>]*\b(SYSTEM|PUBLIC)\b/i.test(head);
  return {
    file: fileName,
    line,
    code: 'forbidden-xml-construct',
    expected: 'XML without a DOCTYPE or entity declarations (they are never expanded or fetched)',
    found:
      entity !== null
        ? `entity declarations${external ? ' naming external resources' : ''}`
        : `a DOCTYPE${external ? ' naming an external resource' : ''}`,
  };
}
