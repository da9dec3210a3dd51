import { useId, useState } from 'react';
import { MAX_CSV_BYTES, csvTooLargeMessage, type CsvImport as CsvImportResult, type TableDatasetSpec } from '../../../problems';
import { useActions } from '../../app-context';
import { csvFailureText, csvProblemText } from '../../messages';

/**
 * Import a CSV file: parsed in the worker with a progress bar; rows that cannot be read are listed by
 * row number (the header is row 1) and can be dropped, after which the table is offered for fitting.
 */
export function CsvImport({ onTable, onFailed }: { onTable(table: TableDatasetSpec): void; /** The file could not be imported (nothing usable to offer). */ onFailed(): void }) {
  const actions = useActions();
  const id = useId();
  const [file, setFile] = useState<{ name: string; text: string } | null>(null);
  const [drop, setDrop] = useState(false);
  const [progress, setProgress] = useState<number | null>(null);
  const [result, setResult] = useState<CsvImportResult | null>(null);

  async function parse(name: string, text: string, dropBadRows: boolean) {
    setProgress(0);
    setResult(null);
    const r = await actions.importCsv(text, { name, dropBadRows }, (f) => setProgress(f));
    setProgress(null);
    setResult(r);
    if (r.ok && (r.problems.length === 0 || dropBadRows)) onTable(r.dataset);
    else onFailed();
  }

  return (
    <div className="csv-import">
      <label className="file-button" htmlFor={`${id}-file`}>
        Import a CSV file…
      </label>
      <input
        id={`${id}-file`}
        className="visually-hidden"
        type="file"
        accept=".csv,text/csv,text/plain"
        onChange={async (e) => {
          const f = e.target.files?.[0];
          if (!f) return;
          if (f.size > MAX_CSV_BYTES) {
            // Refused before reading: a file far over the limit is never loaded into the page.
            setFile({ name: f.name, text: '' });
            setResult({ ok: false, message: csvTooLargeMessage(f.size), problems: [], moreProblems: 0 });
            e.target.value = '';
            return onFailed();
          }
          const text = await f.text();
          setFile({ name: f.name, text });
          await parse(f.name, text, drop);
          e.target.value = '';
        }}
      />
      <label className="field-check-inline">
        <input
          type="checkbox"
          checked={drop}
          onChange={async (e) => {
            setDrop(e.target.checked);
            if (file) await parse(file.name, file.text, e.target.checked);
          }}
        />{' '}
        drop rows that cannot be read
      </label>
      {progress !== null && (
        <div role="progressbar" aria-label="Reading the file" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(progress * 100)} className="progress">
          reading {Math.round(progress * 100)}%
        </div>
      )}
      {result && !result.ok && (
        <div className="field-error" role="alert" data-testid="csv-error">
          {file?.name}: {csvFailureText(result)}
        </div>
      )}
      {result && result.problems.length > 0 && (
        <div className={result.ok && drop ? 'csv-problems dropped' : 'field-error csv-problems'} role="alert" data-testid="csv-problems">
          {result.ok && drop
            ? `${result.droppedRows} row${result.droppedRows === 1 ? '' : 's'} dropped:`
            : `${result.problems.length + result.moreProblems} value${result.problems.length + result.moreProblems === 1 ? '' : 's'} could not be read (tick "drop rows" to leave those rows out):`}
          <ul>
            {result.problems.slice(0, 8).map((p, k) => (
              <li key={k}>{csvProblemText(p)}</li>
            ))}
            {result.problems.length + result.moreProblems > 8 && <li>and {result.problems.length + result.moreProblems - 8} more</li>}
          </ul>
        </div>
      )}
      {result?.ok && <p className="field-help">{result.dataset.name}: {result.dataset.rows.length} rows, columns {result.dataset.columns.join(', ')}</p>}
    </div>
  );
}
