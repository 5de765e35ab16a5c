// Turns DXF text values into plain text: `\U+XXXX` escapes, `%%` specials and MTEXT formatting codes.
// Layer names and labels written by R2000-R2004 programs carry `\U+` escapes for non-ASCII characters.

const SPECIALS: Record<string, string> = { c: '\u2300', d: '\u00b0', p: '\u00b1', '%': '%' };

/** Decodes `\U+XXXX` escapes (DXF R2000-R2004 non-ASCII characters). */
export function decodeUnicodeEscapes(s: string): string {
  return s.replace(/\\U\+([0-9a-fA-F]{4})/g, (_, hex: string) => String.fromCharCode(parseInt(hex, 16)));
}

/** Plain text of a TEXT/ATTRIB value: unicode escapes and `%%c`, `%%d`, `%%p`, `%%%`; underline toggles dropped. */
export function plainText(s: string): string {
  return decodeUnicodeEscapes(s)
    .replace(/%%([cdp%])/gi, (_, k: string) => SPECIALS[k.toLowerCase()] ?? '')
    .replace(/%%[ouk]/gi, '');
}

/** Plain text of an MTEXT value: paragraph breaks become newlines, formatting groups and codes are removed. */
export function plainMText(s: string): string {
  let out = '';
  for (let i = 0; i < s.length; i++) {
    const ch = s[i]!;
    if (ch === '{' || ch === '}') continue;
    if (ch !== '\\') {
      out += ch;
      continue;
    }
    const code = s[i + 1];
    if (code === undefined) break;
    i++;
    switch (code) {
      case 'P':
        out += '\n';
        break;
      case '~':
        out += ' ';
        break;
      case '\\':
      case '{':
      case '}':
        out += code;
        break;
      case 'L':
      case 'l':
      case 'O':
      case 'o':
      case 'K':
      case 'k':
        break;
      case 'S': {
        // Stacked fraction: \S1/2; or \S1^2; or \S1#2;
        const end = s.indexOf(';', i);
        const body = end < 0 ? s.slice(i + 1) : s.slice(i + 1, end);
        // After a whole number the fraction reads as a mixed number: 1\S1/4; is "1 1/4".
        out += (/\d$/.test(out) ? ' ' : '') + body.replace(/[\^#]/, '/');
        i = end < 0 ? s.length : end;
        break;
      }
      case 'U':
        if (s[i + 1] === '+' && /^[0-9a-fA-F]{4}$/.test(s.slice(i + 2, i + 6))) {
          out += String.fromCharCode(parseInt(s.slice(i + 2, i + 6), 16));
          i += 5;
        }
        break;
      default: {
        // Codes with an argument up to ';': \f \F \H \C \c \W \Q \T \A \p
        const end = s.indexOf(';', i);
        i = end < 0 ? s.length : end;
      }
    }
  }
  return plainText(out);
}
