// Tells a DWG file by its first bytes (AC10xx, the version tag) and which versions the reader takes, apart from the
// reader itself so that telling costs nothing (LibreDWG loads only for a DWG).

/** The DWG versions LibreDWG reads fully, by the file's first six bytes: R13 to 2018. */
const VERSIONS: Record<string, string> = {
  AC1012: 'R13',
  AC1014: 'R14',
  AC1015: '2000',
  AC1018: '2004',
  AC1021: '2007',
  AC1024: '2010',
  AC1027: '2013',
  AC1032: '2018',
};

/** The file's DWG version tag (AC10xx) when it is a DWG: its first bytes say so, not its name. */
export function dwgVersionTag(bytes: Uint8Array): string | null {
  if (bytes.length < 6) return null;
  let tag = '';
  for (let i = 0; i < 6; i++) tag += String.fromCharCode(bytes[i]!);
  return /^AC\d{4}$/.test(tag) ? tag : null;
}

/** The release a version tag names (R14, 2018), or null for a version the reader does not take. */
export const dwgRelease = (tag: string): string | null => VERSIONS[tag] ?? null;
