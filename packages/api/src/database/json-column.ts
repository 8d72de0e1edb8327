/**
 * A JSON column read with a raw query: MariaDB's JSON is LONGTEXT, so the connector hands back its text,
 * while other paths may have parsed it already.
 */
export function jsonColumn<T>(value: string | T): T {
  return typeof value === 'string' ? (JSON.parse(value) as T) : value;
}
