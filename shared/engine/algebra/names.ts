// Variable names: the canonical order of symbols and their TeX spelling.

const DIGITS = /^(\D*)(\d*)(.*)$/s;

/**
 * Canonical order of variable names: natural order (digit runs compared by value, so
 * Ra_2 < Ra_10), ties broken by plain code-unit order so the order is total.
 */
export function compareNames(a: string, b: string): number {
  if (a === b) return 0;
  let i = 0;
  let j = 0;
  while (i < a.length && j < b.length) {
    const ca = a.charCodeAt(i);
    const cb = b.charCodeAt(j);
    const da = ca >= 48 && ca <= 57;
    const db = cb >= 48 && cb <= 57;
    if (da && db) {
      let ie = i;
      while (ie < a.length && a.charCodeAt(ie) >= 48 && a.charCodeAt(ie) <= 57) ie++;
      let je = j;
      while (je < b.length && b.charCodeAt(je) >= 48 && b.charCodeAt(je) <= 57) je++;
      const na = a.slice(i, ie).replace(/^0+(?=\d)/, "");
      const nb = b.slice(j, je).replace(/^0+(?=\d)/, "");
      if (na.length !== nb.length) return na.length - nb.length;
      if (na !== nb) return na < nb ? -1 : 1;
      i = ie;
      j = je;
      continue;
    }
    if (ca !== cb) return ca - cb;
    i++;
    j++;
  }
  if (a.length - i !== b.length - j) return a.length - i - (b.length - j);
  return a < b ? -1 : 1;
}

export function sortNames(names: Iterable<string>): string[] {
  return [...new Set(names)].sort(compareNames);
}

const GREEK = new Set([
  "alpha", "beta", "gamma", "delta", "epsilon", "zeta", "eta", "theta", "iota", "kappa", "lambda",
  "mu", "nu", "xi", "pi", "rho", "sigma", "tau", "upsilon", "phi", "chi", "psi", "omega",
  "Gamma", "Delta", "Theta", "Lambda", "Xi", "Pi", "Sigma", "Upsilon", "Phi", "Psi", "Omega",
]);

function texBase(base: string): string {
  if (GREEK.has(base)) return `\\${base}`;
  if (base.length <= 1) return base;
  return `\\mathit{${base.replace(/_/g, "\\_")}}`;
}

/** TeX for a symbol: Greek names as \mu etc., trailing digits or "_x" as a subscript (R0 -> R_{0}, r_pi -> r_{\pi}). */
export function texName(name: string): string {
  const us = name.indexOf("_");
  if (us > 0 && us < name.length - 1) {
    return `${texBase(name.slice(0, us))}_{${texSubscript(name.slice(us + 1))}}`;
  }
  const m = DIGITS.exec(name);
  if (m && m[1] && m[2] && !m[3]) return `${texBase(m[1])}_{${m[2]}}`;
  return texBase(name);
}

function texSubscript(sub: string): string {
  if (GREEK.has(sub)) return `\\${sub}`;
  if (/^[A-Za-z0-9]+$/.test(sub)) {
    return sub.length === 1 || /^\d+$/.test(sub) ? sub : `\\mathrm{${sub}}`;
  }
  return `\\mathrm{${sub.replace(/_/g, "\\_")}}`;
}
