/**
 * The loss chart as a figure: the chart as drawn on the page (drawLossChart, with the multi-start
 * band when a multi-start study has results) and a key of the runs and the band.
 */
import type { AppState } from '../../../store/app-store';
import type { LiveRuns } from '../../../store/live-runs';
import type { StudyState } from '../../../store/study-store';
import { BAND_STYLE, chooseLossAxis, drawLossChart, knownMinimumOf, lossSeriesOf, type LossBand } from '../../chart/loss-chart';
import type { Figure } from '../compose';
import type { KeyEntry } from '../key';

/** The band of a finished multi-start study, with the words its legend entry uses; null otherwise. */
export function multiStartBand(study: Pick<StudyState, 'spec' | 'bands' | 'configLabel'>): (LossBand & { medianLabel: string; bandLabel: string }) | null {
  if (study.spec?.kind !== 'multi-start' || !study.bands || study.bands.length < 3) return null;
  return {
    quantiles: study.bands,
    medianLabel: `multi-start median, ${study.spec.count} starts of “${study.configLabel}”`,
    bandLabel: 'multi-start 25–75% band',
  };
}

export function lossFigure(s: AppState, live: LiveRuns, study: StudyState): Figure {
  const series = lossSeriesOf(s.workspace.runs, live);
  const band = multiStartBand(study);
  const axis = chooseLossAxis(series, knownMinimumOf(s.surfaceInfo.knownPoints));
  const key: KeyEntry[] = series.map((t) => ({ kind: 'run', style: t.style, label: t.label }));
  if (band)
    key.push(
      { kind: 'line', colour: BAND_STYLE.median, dash: [...BAND_STYLE.medianDash], label: band.medianLabel },
      { kind: 'band', colour: BAND_STYLE.fill, label: band.bandLabel },
    );
  return {
    title: `Loss by step: ${s.surfaceInfo.label}`,
    key,
    drawBody: (ctx, size) => drawLossChart(ctx, size, series, axis, band),
  };
}
