import { parseDatasetCsv } from '../problems';
import type { CsvParseOptions, FromWorker } from '../protocol';

/**
 * CSV import in the worker: papaparse reads the text in chunks and each chunk's progress is posted, so a
 * large file never freezes the page. The result (a table spec, or the rows that could not be read) goes
 * back whole.
 */
export function parseCsvInWorker(post: (msg: FromWorker) => void, requestId: string, text: string, options: CsvParseOptions): void {
  let lastReport = 0;
  const result = parseDatasetCsv(text, {
    ...options,
    chunkSize: 256 * 1024,
    onProgress: ({ fraction, rowsRead }) => {
      if (fraction - lastReport < 0.05 && fraction < 1) return;
      lastReport = fraction;
      post({ type: 'csv/progress', requestId, fraction, rowsRead });
    },
  });
  post({ type: 'csv/result', requestId, result });
}
