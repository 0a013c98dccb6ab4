import { ErrorState, LoadingState } from "@/components/ui/states";
import { useOpenApi, type OpenApiDocument, type Operation } from "../api/get-openapi";
import { SchemaView } from "./schema-view";

const methodOrder = ["get", "post", "patch", "put", "delete"];

interface Entry {
  method: string;
  path: string;
  operation: Operation;
}

function byTag(document: OpenApiDocument): [string, Entry[]][] {
  const groups = new Map<string, Entry[]>();
  for (const [path, operations] of Object.entries(document.paths)) {
    for (const method of methodOrder) {
      const operation = operations[method];
      if (!operation) continue;
      const tag = operation.tags?.[0] ?? "other";
      groups.set(tag, [...(groups.get(tag) ?? []), { method, path, operation }]);
    }
  }
  return [...groups.entries()];
}

function Access({ operation }: { operation: Operation }) {
  const scope = operation["x-token-scope"];
  return (
    <span className="text-xs text-ink/60">
      {operation.description}
      {scope && <span className="ml-2 rounded border border-verdigris/50 px-1 text-verdigris">token: {scope === "solve" ? "read + solve" : "read"}</span>}
    </span>
  );
}

function OperationView({ entry }: { entry: Entry }) {
  const { method, path, operation } = entry;
  const query = operation.parameters?.filter((p) => p.in === "query") ?? [];
  const body = operation.requestBody?.content;
  const bodyType = body ? Object.keys(body)[0] : null;
  return (
    <article className="border-b border-rule py-3" id={`${method}-${path}`}>
      <h3 className="flex flex-wrap items-baseline gap-2">
        <span className="w-14 font-mono text-xs font-semibold uppercase text-copper">{method}</span>
        <code className="break-all font-mono text-sm">{path}</code>
        <span className="text-sm text-ink/80">{operation.summary}</span>
      </h3>
      <div className="mt-1 space-y-2 sm:ml-16">
        <Access operation={operation} />
        {query.length > 0 && (
          <div>
            <p className="text-xs font-medium">Query</p>
            <SchemaView schema={{ type: "object", properties: Object.fromEntries(query.map((p) => [p.name, p.schema ?? {}])), required: query.filter((p) => p.required).map((p) => p.name) }} />
          </div>
        )}
        {body && bodyType && (
          <div>
            <p className="text-xs font-medium">Body <span className="font-normal text-ink/60">({bodyType})</span></p>
            <SchemaView schema={body[bodyType].schema} />
          </div>
        )}
        <div>
          <p className="text-xs font-medium">Answers</p>
          <ul className="text-xs">
            {Object.entries(operation.responses).map(([status, answer]) => {
              const type = answer.content ? Object.keys(answer.content)[0] : null;
              return (
                <li key={status} className="flex flex-wrap gap-2">
                  <span className="w-14 font-mono">{status}</span>
                  <span className="text-ink/70">{answer.description}</span>
                  {type && <SchemaView schema={answer.content![type].schema} />}
                </li>
              );
            })}
          </ul>
        </div>
      </div>
    </article>
  );
}

// The API as the server describes itself: every route by resource, then every named schema.
export function ApiReference() {
  const document = useOpenApi();
  if (document.isLoading) return <LoadingState label="Loading the API description…" />;
  if (document.isError) return <ErrorState error={document.error} title="The API description could not be loaded" />;
  const doc = document.data!;
  const groups = byTag(doc);
  const schemas = Object.entries(doc.components?.schemas ?? {}).sort(([a], [b]) => a.localeCompare(b));
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-8 lg:grid-cols-[12rem_minmax(0,1fr)]">
      <nav aria-label="Resources" className="text-sm lg:sticky lg:top-4 lg:self-start">
        <ul className="space-y-1">
          {groups.map(([tag]) => (
            <li key={tag}>
              <a href={`#tag-${tag}`} className="hover:text-copper">
                {tag}
              </a>
            </li>
          ))}
          <li>
            <a href="#schemas" className="hover:text-copper">
              schemas
            </a>
          </li>
        </ul>
        <p className="mt-4 text-xs text-ink/60">
          OpenAPI {doc.openapi} ·{" "}
          <a href="/api/openapi.json" className="text-copper hover:underline">
            openapi.json
          </a>
        </p>
      </nav>
      <div>
        {groups.map(([tag, entries]) => (
          <section key={tag} id={`tag-${tag}`} className="mb-6">
            <h2 className="border-b border-ink/30 pb-1 text-lg font-semibold capitalize">{tag}</h2>
            {entries.map((entry) => (
              <OperationView key={`${entry.method} ${entry.path}`} entry={entry} />
            ))}
          </section>
        ))}
        <section id="schemas">
          <h2 className="border-b border-ink/30 pb-1 text-lg font-semibold">Schemas</h2>
          {schemas.map(([name, schema]) => (
            <div key={name} id={`schema-${name}`} className="border-b border-rule py-2">
              <h3 className="font-mono text-sm font-semibold">{name}</h3>
              <div className="mt-1">
                <SchemaView schema={schema} />
              </div>
            </div>
          ))}
        </section>
      </div>
    </div>
  );
}
