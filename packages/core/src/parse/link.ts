/**
 * Which link targets a vertex may carry. A diagram is inlined into documentation pages, so a link is
 * an attack surface: only targets that stay navigations to web pages are accepted.
 *
 * Accepted, and nothing else:
 * - an absolute `http:` or `https:` URL with a host (`https://docs.example/queue`);
 * - a `#fragment` on the current page;
 * - a relative path (`../stores/ledger.md`, `ledger.html#balances`, `?tab=2`) whose first segment has
 *   no `:`, so no URL parser can read a scheme out of it.
 *
 * Refused (rule `unsafe-link`): every other scheme (`javascript:`, `data:`, `vbscript:`, `file:` …),
 * protocol-relative `//host` (it leaves the site with whatever scheme the page has), any backslash
 * (browsers read `\` as `/` in web URLs, so `/\host` is protocol-relative too), whitespace and
 * control or format characters anywhere (browsers strip or skip some of them before reading the
 * scheme, which is how `java\tscript:` tricks work), and `"`, `'`, `<`, `>`, `` ` `` which have no
 * business in a URL written by hand. Checking the raw text (no decoding) is deliberate: a
 * percent-encoded `javascript%3A` stays a harmless relative path, because browsers never decode a
 * scheme. Linear in the length of the target.
 */
export type LinkCheck = {ok: true} | {ok: false; reason: string}

const scheme = /^([A-Za-z][A-Za-z0-9+.-]*):/
/** Whitespace (any Unicode space), C0/C1 controls, format characters (zero-width, bidi), lone surrogates. */
const invisible = /[\p{White_Space}\p{Cc}\p{Cf}\p{Cs}]/u
const forbidden = /["'<>`\\]/

export function checkLinkTarget(target: string): LinkCheck {
  if (target.length === 0) return {ok: false, reason: 'This link is empty: write a page address between `<` and `>`.'}
  const hidden = invisible.exec(target)
  if (hidden) {
    const code = 'U+' + hidden[0].codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')
    return {ok: false, reason: `This link contains ${code} (a space, control or invisible character); links may not contain any, so encode a space as \`%20\`.`}
  }
  const bad = forbidden.exec(target)
  if (bad) return {ok: false, reason: `This link contains \`${bad[0]}\`, which is not allowed in a link; percent-encode it if the address really needs it.`}
  if (target.startsWith('#')) return {ok: true}
  if (target.startsWith('//')) {
    return {ok: false, reason: 'A link starting with `//` goes to another site without saying how: write it in full with `https://`.'}
  }
  const match = scheme.exec(target)
  if (match) {
    const name = match[1]!.toLowerCase()
    if (name !== 'http' && name !== 'https') {
      return {ok: false, reason: `Links with \`${match[1]}:\` are not allowed: only \`https://\` and \`http://\` addresses, relative paths and \`#fragments\`.`}
    }
    if (!/^[A-Za-z]+:\/\/[^/?#]/.test(target)) return {ok: false, reason: `This \`${match[1]}:\` link has no host: write it as \`${name}://host/path\`.`}
    return {ok: true}
  }
  // A relative path: a `:` before the first `/`, `?` or `#` would be read as a scheme by some parser.
  const firstSegment = /^[^/?#]*/.exec(target)![0]
  if (firstSegment.includes(':')) {
    return {ok: false, reason: 'The first part of this link holds a `:` and would be read as a scheme; write `./` before a relative path that needs one.'}
  }
  return {ok: true}
}
