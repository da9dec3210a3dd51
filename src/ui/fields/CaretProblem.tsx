/**
 * A problem in typed text: the message, then the line of text with a row of carets under the offending
 * columns [start, end) (0-based, clamped to the line; at least one caret). Shared by the formula and
 * rule editors.
 */
export function CaretProblem({ message, line, start, end, tone = 'error' }: { message: string; line?: string; start?: number; end?: number; tone?: 'error' | 'warning' }) {
  const from = line !== undefined && start !== undefined ? Math.min(start, line.length) : 0;
  const width = line !== undefined && end !== undefined ? Math.max(1, Math.min(end, line.length + 1) - from) : 0;
  return (
    <div className={`${tone === 'error' ? 'field-error' : 'field-warning'} formula-problem`} role={tone === 'error' ? 'alert' : 'status'}>
      <div className="formula-problem-message">{message}</div>
      {line !== undefined && start !== undefined && (
        <pre className="mono formula-caret" aria-hidden="true">
          {line}
          {'\n'}
          {' '.repeat(from)}
          {'^'.repeat(width)}
        </pre>
      )}
    </div>
  );
}
