export function Steps({ title, method, steps, result }: { title: string; method?: string; steps: { label: string; value: string }[]; result: string }) {
  return (
    <details className="rounded-md border border-line p-3" open>
      <summary className="cursor-pointer font-bold">
        {title}: {result}
      </summary>
      {method ? <p className="mt-1 text-2xs text-ink-soft">Method: {method}</p> : null}
      <ol className="mt-2 space-y-0.5 text-sm">
        {steps.map((s, i) => (
          <li key={i} className="grid grid-cols-[minmax(7rem,1fr)_minmax(0,auto)] gap-3 border-b border-line/60 py-0.5">
            <span>{s.label}</span>
            <span className="text-right font-mono tabular-nums [overflow-wrap:anywhere]">{s.value}</span>
          </li>
        ))}
      </ol>
    </details>
  );
}
