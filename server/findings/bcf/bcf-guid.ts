/**
 * The two identifier forms in a BCF file: UUIDs for topics, comments and viewpoints (markup.xsd `Guid`; lowercase
 * only in 3.0's shared-types.xsd) and IFC GlobalIds in their 22-character form for components (visinfo.xsd `IfcGuid`).
 */
import { createHash } from 'node:crypto';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/**
 * IFC's compressed GlobalId: 128 bits in 22 characters of the alphabet 0-9 A-Z a-z _ $; the first character carries
 * only 2 bits, so it is 0–3 (IFC 4.3 documentation, IfcGloballyUniqueId).
 */
const IFC_GLOBAL_ID = /^[0-3][0-9A-Za-z_$]{21}$/;

export function isUuid(value: string): boolean {
  return UUID.test(value);
}

export function isIfcGlobalId(value: string): boolean {
  return IFC_GLOBAL_ID.test(value);
}

/**
 * Name-based UUID (RFC 4122 §4.3, version 5, SHA-1) under a namespace UUID, so derived ids (a topic's default
 * viewpoint) stay the same from one export to the next.
 */
export function nameBasedUuid(namespaceUuid: string, name: string): string {
  const namespace = Buffer.from(namespaceUuid.replace(/-/g, ''), 'hex');
  const hash = createHash('sha1').update(namespace).update(name, 'utf8').digest();
  hash[6] = (hash[6] & 0x0f) | 0x50;
  hash[8] = (hash[8] & 0x3f) | 0x80;
  const hex = hash.subarray(0, 16).toString('hex');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}
