import { parseSI } from "@/lib/engine";

/** A number typed with an optional SI prefix and the unit ("50 Ω", "1.2k", "3 mA", "10 kHz"), kept exact. */
export function readTypedNumber(text: string, unit: string): { value: ReturnType<typeof parseSI> } | { error: string } {
  let t = text.trim().replace(/\s+/g, "");
  if (unit && t.endsWith(unit)) t = t.slice(0, -unit.length);
  if (unit === "Ω" && /ohms?$/i.test(t)) t = t.replace(/ohms?$/i, "");
  if (t === "") return { error: "type a value" };
  try {
    return { value: parseSI(t) };
  } catch (e) {
    return { error: e instanceof Error ? e.message : "not a number" };
  }
}
