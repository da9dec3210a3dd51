// The workspace types live with the experiment file they are saved as (src/io/experiment/types.ts).
export type { DisplaySettings, PanelMode, PanelSettings, PlaneSlice, RunConfig, SliceSettings, Workspace } from '../io/experiment/types';
import type { DisplaySettings } from '../io/experiment/types';

export const DEFAULT_DISPLAY: DisplaySettings = {
  scale: 'log',
  levels: 24,
  colourMap: 'viridis',
  resolution: 192,
  showArrows: false,
  showKnownPoints: true,
};
