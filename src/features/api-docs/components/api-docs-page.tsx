import { useMemo, useState } from 'react';
import { TextField } from '@/components/ui/field';
import { EmptyState, Panel, QueryStatus } from '@/components/ui/states';
import { OPENAPI_URL, useOpenApi } from '../api/openapi';
import { describeAccess, filterGroups, groupOperations, type OperationView } from '../openapi-model';

const anchor = (tag: string) => `api-${tag.toLowerCase().replace(/[^a-z0-9]+/g, '-')}`;

function Method({ method }: { method: string }) {
  return <span className="inline-block w-16 shrink-0 rounded-plate border border-ink/30 px-1.5 py-0.5 text-center font-mono text-xs font-bold uppercase">{method}</span>;
}

function Operation({ op }: { op: OperationView }) {
  return (
    <details className="group border-t border-chart-line/60 first:border-t-0" data-testid="api-operation">
      <summary className="flex cursor-pointer flex-wrap items-center gap-x-3 gap-y-1 py-2 hover:bg-chart-deep/40">
        <Method method={op.method} />
        <code className="font-mono text-sm font-bold">{op.path}</code>
        <span className="text-sm text-ink-soft">{op.summary}</span>
        <span className="ml-auto text-xs text-ink-faint">{describeAccess(op.access)}</span>
      </summary>
      <div className="flex flex-col gap-3 pb-4 pl-2 text-sm md:pl-[4.75rem]">
        {op.description ? <p className="whitespace-pre-line">{op.description}</p> : null}
        <p>
          <span className="text-xs font-bold uppercase tracking-wide text-ink-soft">Who may call it: </span>
          {describeAccess(op.access)}
        </p>
        {op.parameters.length ? (
          <table className="w-full max-w-3xl text-sm" aria-label={`Parameters of ${op.method.toUpperCase()} ${op.path}`}>
            <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
              <tr>
                <th scope="col" className="pr-3">Parameter</th>
                <th scope="col" className="pr-3">In</th>
                <th scope="col" className="pr-3">Type</th>
                <th scope="col">Description</th>
              </tr>
            </thead>
            <tbody>
              {op.parameters.map((p) => (
                <tr key={`${p.in}-${p.name}`} className="border-t border-chart-line/60 align-top">
                  <td className="py-1 pr-3 font-mono text-xs">
                    {p.name}
                    {p.required ? <span className="ml-1 text-verdict-fail">required</span> : null}
                  </td>
                  <td className="py-1 pr-3">{p.in}</td>
                  <td className="py-1 pr-3 font-mono text-xs">{p.type || '—'}</td>
                  <td className="py-1">{p.description}</td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
        {op.requestSchema !== null ? (
          <div>
            <p className="text-xs font-bold uppercase tracking-wide text-ink-soft">Request body ({op.requestContentType})</p>
            <pre className="mt-1 max-h-96 overflow-auto rounded-plate bg-white p-3 font-mono text-xs" aria-label={`Request schema of ${op.method.toUpperCase()} ${op.path}`}>
              {JSON.stringify(op.requestSchema, null, 2)}
            </pre>
          </div>
        ) : null}
        {op.responses.length ? (
          <div>
            <p className="text-xs font-bold uppercase tracking-wide text-ink-soft">Answers</p>
            <ul className="mt-1">
              {op.responses.map((r) => (
                <li key={r.status}>
                  <code className="font-mono text-xs font-bold">{r.status}</code> {r.description}
                </li>
              ))}
            </ul>
          </div>
        ) : null}
      </div>
    </details>
  );
}

function HowToCall() {
  const origin = window.location.origin;
  return (
    <Panel title="Calling the API from a script">
      <div className="flex flex-col gap-2 text-sm">
        <p>
          Every page of Isobath uses this API. Requests and answers are JSON, all values in SI units (Pa, m, kg/m³, °C). Sign in once and send the session cookie with each
          call; a call your role may not make is refused with 403, and errors come as <code className="font-mono text-xs">{'{ "error": { "code", "message", "fields" } }'}</code>.
          Changes from another web site's pages are refused, scripts are not.
        </p>
        <pre className="overflow-auto rounded-plate bg-white p-3 font-mono text-xs">
          {`curl -c isobath.jar -H 'content-type: application/json' \\
  -d '{"email":"you@harrow.example","password":"<your password>"}' ${origin}/api/auth/login

curl -b isobath.jar '${origin}/api/pressure?depth=1200&latitude=57&water=sea'`}
        </pre>
        <p>
          The machine-readable description (OpenAPI 3.1) is at{' '}
          <a href={OPENAPI_URL} className="font-mono text-xs font-bold text-sounding underline">
            {OPENAPI_URL}
          </a>
          .
        </p>
      </div>
    </Panel>
  );
}

/** A browsable list of the API's operations, from the server's own OpenAPI document. */
export function ApiDocsPage() {
  const doc = useOpenApi();
  const [query, setQuery] = useState('');
  const groups = useMemo(() => (doc.data ? groupOperations(doc.data) : []), [doc.data]);
  const shown = useMemo(() => filterGroups(groups, query), [groups, query]);
  const total = groups.reduce((n, g) => n + g.operations.length, 0);

  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-2xl font-bold">API</h1>
        <p className="text-sm text-ink-soft">
          For integrators: every operation, who may call it, and what it takes.
          {doc.data?.info?.version ? ` Version ${doc.data.info.version}.` : ''}
        </p>
      </div>
      <HowToCall />
      {doc.isPending || doc.isError ? (
        <QueryStatus query={doc} loading="Loading the API description…" />
      ) : doc.data === null ? (
        <EmptyState title="This server does not publish its API description yet">
          The list of operations appears here once the server offers <code className="font-mono text-xs">{OPENAPI_URL}</code>. Until then, the calls above work as described.
        </EmptyState>
      ) : total === 0 ? (
        <EmptyState title="The API description lists no operations" />
      ) : (
        <div className="grid gap-4 lg:grid-cols-[14rem_1fr]">
          <nav aria-label="API sections" className="flex flex-col gap-1 self-start text-sm lg:sticky lg:top-4">
            <TextField label="Find" type="search" value={query} onChange={(e) => setQuery(e.target.value)} placeholder="path, method or words" />
            <ul className="mt-2 flex flex-col gap-0.5">
              {shown.map((g) => (
                <li key={g.tag}>
                  <a href={`#${anchor(g.tag)}`} className="text-sounding hover:underline">
                    {g.tag}
                  </a>{' '}
                  <span className="text-xs text-ink-faint">{g.operations.length}</span>
                </li>
              ))}
            </ul>
          </nav>
          <div className="flex min-w-0 flex-col gap-4">
            {shown.length === 0 ? <EmptyState title="No operation matches">Try fewer or other words.</EmptyState> : null}
            {shown.map((g) => (
              <section key={g.tag} id={anchor(g.tag)} aria-label={g.tag} className="rounded-plate bg-chart-raised px-4 py-3 shadow-plate">
                <h2 className="text-sm font-bold uppercase tracking-wide text-ink-soft">{g.tag}</h2>
                {g.description ? <p className="text-sm text-ink-soft">{g.description}</p> : null}
                <div className="mt-2">
                  {g.operations.map((op) => (
                    <Operation key={op.id} op={op} />
                  ))}
                </div>
              </section>
            ))}
          </div>
        </div>
      )}
    </div>
  );
}
