// Escapes text for HTML and SVG markup: the one escaper of every page headcheck writes.

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export const escapeHtml = (s: unknown): string => String(s ?? '').replace(/[&<>"']/g, (c) => ENTITIES[c]!);
