import { drawLossChart, type LossAxis } from '../chart/loss-chart';
import type { DrawingContext, PixelSize } from '../plot';

/**
 * The loss across the starts of a multi-start study, step by step: the loss chart (chart/loss-chart.ts)
 * with no runs, only the band between the 25% and 75% quantiles and the median (bands from
 * engine/study/quantiles.ts), on the same axes and in the same style as the band under the runs.
 */
export function drawBandChart(ctx: DrawingContext, size: PixelSize, bands: readonly Float64Array[], axis: LossAxis): void {
  drawLossChart(ctx, size, [], axis, { quantiles: bands });
}
