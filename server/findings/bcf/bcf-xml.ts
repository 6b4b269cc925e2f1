/**
 * XML in and out of a BCF archive. Writing goes through fast-xml-parser's XMLBuilder, which escapes every text and
 * attribute value; reading refuses anything with a document type declaration before a parser sees it, so no entity
 * (internal or external) is ever expanded.
 */
import { XMLBuilder, XMLParser, XMLValidator } from 'fast-xml-parser';
import { ValidationError } from '../../http/errors';
import { distinctValues } from '../export/finding-export';

/** An element tree for XMLBuilder: `@_name` keys are attributes, arrays repeat an element, undefined is left out. */
export type XmlNode = { [key: string]: XmlValue };
export type XmlValue = string | number | boolean | undefined | XmlNode | readonly (string | number | XmlNode)[];

const builder = new XMLBuilder({
  ignoreAttributes: false,
  attributeNamePrefix: '@_',
  format: true,
  indentBy: '  ',
  // The default writes an attribute whose value is "true" without a value, which is not XML.
  suppressBooleanAttributes: false,
  suppressEmptyNode: true,
  processEntities: true,
});

/** Characters outside the XML 1.0 `Char` production (§2.2) cannot be written even escaped; they become U+FFFD. */
const NOT_XML_CHAR = /[^\t\n\r\u0020-\uD7FF\uE000-\uFFFD\u{10000}-\u{10FFFF}]/gu;

export function xmlText(value: string): string {
  return value.replace(NOT_XML_CHAR, '\uFFFD');
}

/** Trimmed, non-blank, first occurrence only, ready for XML. */
export function distinctTexts(values: readonly string[]): string[] {
  return distinctValues(values).map(xmlText);
}

/** A complete UTF-8 document for one root element. */
export function buildXmlDocument(rootName: string, root: XmlNode): Buffer {
  const body = builder.build({ [rootName]: root }) as string;
  return Buffer.from(`<?xml version="1.0" encoding="UTF-8"?>\n${body}`, 'utf8');
}

const parser = new XMLParser({
  ignoreAttributes: false,
  attributeNamePrefix: '@_',
  // Keep every value a string: titles such as "1e3" or GUID-like numbers must not turn into numbers.
  parseTagValue: false,
  parseAttributeValue: false,
  trimValues: true,
  removeNSPrefix: true,
  ignoreDeclaration: true,
  ignorePiTags: true,
  // Only for numeric character references (&#10;); named entities beyond XML's five are not in BCF files.
  htmlEntities: true,
});

const UTF8 = new TextDecoder('utf-8', { fatal: true });

/**
 * Parses one XML entry of the archive. Refuses UTF-16 and other encodings (BCF files are UTF-8), any DOCTYPE
 * (the only way to declare entities, so this shuts out XXE and entity-expansion bombs) and malformed XML, each with
 * a message naming the entry.
 */
export function parseXmlEntry(bytes: Buffer, entryName: string): Record<string, unknown> {
  if ((bytes[0] === 0xfe && bytes[1] === 0xff) || (bytes[0] === 0xff && bytes[1] === 0xfe) || bytes.includes(0)) {
    throw new ValidationError(`${entryName} is not UTF-8 encoded; BCF files must be UTF-8.`, { code: 'bcf_malformed_xml' });
  }
  let text: string;
  try {
    text = UTF8.decode(bytes);
  } catch {
    throw new ValidationError(`${entryName} is not valid UTF-8 text.`, { code: 'bcf_malformed_xml' });
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (/<!DOCTYPE/i.test(text) || /<!ENTITY/i.test(text)) {
    throw new ValidationError(
      `${entryName} contains a document type declaration, which is refused (it could pull in external files).`,
      { code: 'bcf_unsafe_xml' },
    );
  }
  const declared = /^\s*<\?xml[^>]*\bencoding\s*=\s*["']([^"']+)["']/i.exec(text)?.[1];
  if (declared !== undefined && !/^(utf-?8|us-ascii)$/i.test(declared)) {
    throw new ValidationError(`${entryName} declares encoding ${declared}; BCF files must be UTF-8.`, { code: 'bcf_malformed_xml' });
  }
  const check = XMLValidator.validate(text);
  if (check !== true) {
    throw new ValidationError(`${entryName} is not well-formed XML (line ${check.err.line}: ${check.err.msg}).`, {
      code: 'bcf_malformed_xml',
    });
  }
  return parser.parse(text) as Record<string, unknown>;
}

/** Reading helpers for the parsed tree, where one child is an object and several are an array. */
export function childrenOf(node: unknown, name: string): unknown[] {
  if (node === null || typeof node !== 'object') return [];
  const value = (node as Record<string, unknown>)[name];
  if (value === undefined) return [];
  return Array.isArray(value) ? value : [value];
}

export function childOf(node: unknown, name: string): unknown {
  return childrenOf(node, name)[0];
}

/** Text content of an element (with or without attributes); undefined when absent or empty. */
export function textOf(node: unknown): string | undefined {
  if (typeof node === 'string') return node === '' ? undefined : node;
  if (node !== null && typeof node === 'object') {
    const text = (node as Record<string, unknown>)['#text'];
    if (typeof text === 'string' && text !== '') return text;
  }
  return undefined;
}

export function childText(node: unknown, name: string): string | undefined {
  return textOf(childOf(node, name));
}

export function attributeOf(node: unknown, name: string): string | undefined {
  if (node === null || typeof node !== 'object') return undefined;
  const value = (node as Record<string, unknown>)[`@_${name}`];
  return typeof value === 'string' ? value : undefined;
}
