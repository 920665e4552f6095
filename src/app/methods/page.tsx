import type { Metadata } from "next";
import Link from "next/link";
import { OUTPUT_FIELDS } from "@/engine";
import { CITATIONS } from "@/engine/methods/citations";
import { METHOD_ENTRIES } from "@/engine/methods/method-entries";
import type { SourceStatus } from "@/engine/provenance";

export const metadata: Metadata = { title: "Methods and sources" };

// How the product knows each source, in words (never a bracketed tag).
const STATUS_WORDS: Record<SourceStatus, string> = {
  seen: "Read at the address given; only what it shows is relied on.",
  recalled: "Cited from the book or standard as remembered: edition, chapter and clause not re-read. Check before quoting it.",
  derived: "Worked out for this product and checked by a second, independent method.",
  "common-practice": "Common practice: no published source.",
};

/**
 * The methods page: public, one anchor per entry (its stable key) and per source (its citation key), made
 * from the same table as the API docs' list of outputs (src/engine/output-fields.ts), so they cannot drift.
 */
export default function MethodsPage() {
  return (
    <main className="mx-auto max-w-4xl px-6 py-10">
      <p className="text-sm">
        <Link href="/" className="text-steel hover:underline">Knucklebench</Link>
      </p>
      <h1 className="mt-2 text-3xl font-semibold tracking-tight text-steel">Methods and sources</h1>
      <p className="mt-3 leading-relaxed text-ink">
        How every figure on a kit&apos;s page and in the analysis API is worked out: its definition, formula, unit, sign
        convention and valid range, and the sources it rests on. Each entry and each source has a stable address
        (this page, <code>#</code> and its key): the readouts link here, and every source the API names is one of
        the keys below.
      </p>
      <nav aria-label="Entries" className="mt-6 rounded-lg border border-ink/10 bg-white p-4">
        <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-muted">Entries</h2>
        <ul className="mt-2 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
          {METHOD_ENTRIES.map((m) => (
            <li key={m.key}><a href={`#${m.key}`} className="text-steel hover:underline">{m.title}</a></li>
          ))}
          <li><a href="#sources" className="text-steel hover:underline">Sources</a></li>
        </ul>
      </nav>

      {METHOD_ENTRIES.map((m) => {
        const fields = OUTPUT_FIELDS.filter((f) => f.method === m.key);
        return (
          <section key={m.key} id={m.key} aria-labelledby={`${m.key}-title`} className="mt-8 scroll-mt-6 rounded-lg border border-ink/10 bg-white p-5" data-method={m.key}>
            <h2 id={`${m.key}-title`} className="text-xl font-semibold">{m.title}</h2>
            <p className="mt-1 text-sm text-ink-muted">{m.explain}</p>
            <p className="mt-3 leading-relaxed">{m.definition}</p>
            {m.formula ? (
              <p className="mt-3 overflow-x-auto rounded bg-paper px-3 py-2 font-mono text-sm" aria-label="Formula">{m.formula}</p>
            ) : null}
            <dl className="mt-3 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[8rem_1fr]">
              <dt className="font-medium">Unit</dt>
              <dd>{m.unit}</dd>
              <dt className="font-medium">Sign</dt>
              <dd>{m.sign}</dd>
              <dt className="font-medium">Valid range</dt>
              <dd>{m.range}</dd>
              <dt className="font-medium">Sources</dt>
              <dd>
                {m.cites.map((k, i) => {
                  const c = CITATIONS.find((x) => x.key === k)!;
                  return (
                    <span key={k}>
                      {i ? "; " : ""}
                      <a href={`#${k}`} className="text-steel hover:underline">{c.short}</a>
                    </span>
                  );
                })}
              </dd>
            </dl>
            {fields.length ? (
              <table className="mt-4 w-full text-left text-sm">
                <caption className="mb-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-muted">In the analysis answer</caption>
                <thead className="text-xs text-ink-muted">
                  <tr><th className="py-1 pr-3">Field</th><th className="py-1 pr-3">Unit</th><th className="py-1">Sign and meaning</th></tr>
                </thead>
                <tbody className="divide-y divide-ink/10">
                  {fields.map((f) => (
                    <tr key={f.path}>
                      <td className="py-1 pr-3 font-mono text-xs">{f.path}</td>
                      <td className="py-1 pr-3">{f.unit}</td>
                      <td className="py-1">{f.sign}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            ) : null}
          </section>
        );
      })}

      <section id="sources" aria-labelledby="sources-title" className="mt-10 scroll-mt-6">
        <h2 id="sources-title" className="text-2xl font-semibold">Sources</h2>
        <ul className="mt-3 flex flex-col gap-3">
          {CITATIONS.map((c) => (
            <li key={c.key} id={c.key} className="scroll-mt-6 rounded-lg border border-ink/10 bg-white p-4 text-sm" data-citation={c.key}>
              <p className="font-semibold">{c.short} <span className="font-mono text-xs font-normal text-ink-muted">({c.key})</span></p>
              <p className="mt-1 leading-relaxed">{c.text}</p>
              <p className="mt-1 text-ink-muted">Used for: {c.usedFor}</p>
              <p className="mt-1 text-ink-muted">{STATUS_WORDS[c.status]}</p>
              {c.url ? <p className="mt-1 break-all"><a href={c.url} className="text-steel hover:underline" rel="noopener noreferrer">{c.url}</a></p> : null}
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="cautions" className="mt-10 rounded-lg border border-amber-300 bg-amber-50 p-4 text-sm text-amber-950">
        <h2 id="cautions" className="font-semibold">Cautions</h2>
        <ul className="mt-2 list-disc space-y-1 pl-5">
          <li>Strength figures are estimates: printed parts vary with layer direction, infill, temperature and moisture.</li>
          <li>A drivetrain spun up on the bench can throw fragments: guard it and wear eye protection.</li>
          <li>This is a design aid for models, not a sign-off for full-size or road vehicles: defer to local codes and licensed practice.</li>
        </ul>
      </section>
    </main>
  );
}
