export interface EmptyStateProps {
  title: string;
  children: React.ReactNode;
  action?: React.ReactNode;
}

/** What a section shows before it has anything: what will appear here and what to do next. */
export function EmptyState({ title, children, action }: EmptyStateProps) {
  return (
    <div className="rounded-card border border-dashed border-line-strong bg-paper p-6 text-ink-soft" role="status">
      <p className="font-bold text-ink">{title}</p>
      <div className="mt-1 space-y-2 text-sm">{children}</div>
      {action ? <div className="mt-4">{action}</div> : null}
    </div>
  );
}
