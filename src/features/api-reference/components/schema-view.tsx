import type { JsonSchema } from "../api/get-openapi";

const refName = (ref: string) => ref.split("/").pop() ?? ref;

// One line for a schema that needs no table: its type with its bounds.
function typeLabel(schema: JsonSchema | undefined): string {
  if (!schema) return "any";
  if (schema.$ref) return refName(schema.$ref);
  if (schema.enum) return schema.enum.map((v) => JSON.stringify(v)).join(" | ");
  const variants = schema.anyOf ?? schema.oneOf;
  if (variants) return variants.map(typeLabel).join(" | ");
  if (schema.allOf) return schema.allOf.map(typeLabel).join(" & ");
  const type = Array.isArray(schema.type) ? schema.type.join(" | ") : (schema.type ?? "any");
  if (type === "array") return `${typeLabel(schema.items)}[]`;
  if (type === "object" && !schema.properties) return "object";
  const bounds = [
    schema.format,
    schema.minLength !== undefined || schema.maxLength !== undefined ? `${schema.minLength ?? 0}–${schema.maxLength ?? "…"} chars` : null,
    schema.minimum !== undefined || schema.maximum !== undefined ? `${schema.minimum ?? "…"}–${schema.maximum ?? "…"}` : null,
  ].filter(Boolean);
  return bounds.length ? `${type} (${bounds.join(", ")})` : type;
}

// An object's members as a compact table; anything else as its type label. Named schemas link to their section.
export function SchemaView({ schema }: { schema: JsonSchema | undefined }) {
  if (schema?.$ref) {
    const name = refName(schema.$ref);
    return (
      <a href={`#schema-${name}`} className="font-mono text-xs text-copper hover:underline">
        {name}
      </a>
    );
  }
  if (!schema?.properties) return <code className="break-words font-mono text-xs">{typeLabel(schema)}</code>;
  const required = new Set(schema.required ?? []);
  return (
    <table className="w-full text-xs">
      <tbody>
        {Object.entries(schema.properties).map(([name, member]) => (
          <tr key={name} className="border-b border-rule align-top last:border-0">
            <td className="w-1/3 break-all py-0.5 pr-3 font-mono sm:w-48">
              {name}
              {!required.has(name) && <span className="text-ink/50">?</span>}
            </td>
            <td className="py-0.5">
              {member.$ref ? <SchemaView schema={member} /> : <code className="break-words font-mono">{typeLabel(member)}</code>}
              {member.default !== undefined && <span className="text-ink/60"> · default {JSON.stringify(member.default)}</span>}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
