// Words of the earlier interchange format and netlist that were replaced by our own vocabulary.
// A file that still uses one is refused with the word that replaced it, never read silently.

/** Earlier element kind -> what to write now. */
const RENAMED_KINDS: Readonly<Record<string, string>> = {
  vsource: "`vsource` is now `voltage`",
  isource: "`isource` is now `current`",
  vcvs: "`vcvs` is now `voltage` with a value such as `A * across(in, out)`",
  vccs: "`vccs` is now `current` with a value such as `gm * across(in, out)`",
  ccvs: "`ccvs` is now `voltage` with a value such as `rm * through(Rsense)`",
  cccs: "`cccs` is now `current` with a value such as `beta * through(Rb)`",
};

export const RENAMED_CONTROL = "the `control` member is gone: a source names its control in its value, e.g. \"value\": \"gm * across(g, s)\" or \"rm * through(Rsense)\"";

export const RENAMED_INCLUDE = "`include` is now `with`, e.g. `with Cgs Cgd`";

export function renamedKind(kind: string): string | null {
  return Object.hasOwn(RENAMED_KINDS, kind) ? RENAMED_KINDS[kind] : null;
}
