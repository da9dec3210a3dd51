/**
 * The box the map shows: the saved view, widened on one axis when equal scale is on
 * (store/equal-scale.ts). Studies that work "over the current view" use this box, so a start-point map
 * or a critical-point search covers what the user sees.
 */
import { useMemo } from 'react';
import { viewShownBy } from '../../store/app-store';
import type { ViewBox } from '../../engine';
import { useApp } from '../app-context';

export function useShownView(): ViewBox {
  const view = useApp((s) => s.workspace.view);
  const frame = useApp((s) => s.frame);
  const display = useApp((s) => s.workspace.display);
  const surface = useApp((s) => s.workspace.surface);
  const surfaceInfo = useApp((s) => s.surfaceInfo);
  return useMemo(() => viewShownBy({ workspace: { view, display, surface }, frame, surfaceInfo }), [view, frame, display, surface, surfaceInfo]);
}
