export const USAGE = `fall: run Fall Line experiment files (.fall.json) without the page

  fall run FILE --out DIR [--threads N] [--shard i/n] [--force] [--json]
      Runs every run in FILE on N worker threads (default: the core count) and writes into DIR the
      page's two CSV exports (fall-line-trajectories.csv, fall-line-results.csv) and summary.json,
      and for each study in FILE its CSV (fall-line-start-map.study-0.csv, ...).
      --shard i/n runs shard i (0 <= i < n) of n: a fixed share of the runs and of every study's
      runs, written as *.shard-i-of-n.* files (several shards may share DIR). DIR must be empty or new, apart from other
      shards of the same split; --force writes over this command's own files. --json prints progress
      as one JSON object per line on stdout.
  fall merge DIR... [--out DIR] [--force]
      Joins all shards of one experiment found in the DIRs into the single-run files (in --out, by
      default the first DIR); refuses shards of different experiments and missing shards.
  fall check FILE
      Validates FILE and prints every problem as FILE:line:column: $.json.path: reason.
  fall schema
      Prints the JSON Schema of the current experiment file version.

Exit codes: 0 done; 1 bad input (file, option, folder or shards; nothing written);
            2 outputs written but some runs diverged or failed; 130 interrupted (Ctrl-C).
`;
