// Case-insensitive name patterns where `*` matches any run of characters (layer names, block names).
// Compiled once into a predicate; no other wildcard is special.

export type NameMatcher = (name: string) => boolean;

export function compilePatterns(patterns: readonly string[]): NameMatcher {
  if (patterns.length === 0) return () => false;
  const source = patterns
    .map((p) =>
      p
        .split('*')
        .map((part) => part.replace(/[.+?^${}()|[\]\\]/g, '\\$&'))
        .join('.*'),
    )
    .join('|');
  const re = new RegExp(`^(?:${source})$`, 'i');
  return (name) => re.test(name);
}
