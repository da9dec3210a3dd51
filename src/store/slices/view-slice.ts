/** The slice, the view box, the display and the map's frame; each asks for a new grid when the box shown changes. */
import type { ViewActions } from '../app-state';
import { viewShownBy } from '../selectors';
import { defaultView, sameView } from '../surface-info';
import type { SliceContext } from './context';

export function viewSlice(ctx: SliceContext): ViewActions {
  const { get, set, setWorkspace } = ctx;
  return {
    setSlice({ view: requestedView, ...patch }) {
      const s = get();
      const slice = { ...s.workspace.slice, ...patch };
      const axesChanged = patch.axes && (patch.axes[0] !== s.workspace.slice.axes[0] || patch.axes[1] !== s.workspace.slice.axes[1]);
      const planeChanged = patch.plane !== undefined && patch.plane !== s.workspace.slice.plane;
      setWorkspace({ slice, view: planeChanged || axesChanged ? defaultView(s.surfaceInfo, slice, requestedView) : requestedView ?? s.workspace.view });
      ctx.requestGrid();
    },
    setView(view) {
      setWorkspace({ view });
      // Zooming and panning fire many events; the drawn contours follow at once (they live in parameter
      // space) and the finer grid is asked for when the gesture pauses.
      ctx.requestGridWhenQuiet();
    },
    setHover(point) {
      ctx.hover.setState({ hover: point });
    },
    resetView() {
      const s = get();
      s.actions.setView(defaultView(s.surfaceInfo, s.workspace.slice));
    },
    setDisplay(patch) {
      const s = get();
      setWorkspace({ display: { ...s.workspace.display, ...patch } });
      if (patch.resolution !== undefined && patch.resolution !== s.workspace.display.resolution) ctx.requestGrid();
      else if (patch.equalScale !== undefined && !sameView(viewShownBy(get()), viewShownBy(s))) ctx.requestGrid();
    },
    setFrame(frame) {
      const s = get();
      if (s.frame && s.frame.width === frame.width && s.frame.height === frame.height) return;
      set({ frame: { width: frame.width, height: frame.height } });
      if (sameView(viewShownBy(get()), viewShownBy(s))) return;
      // The first measurement replaces the grid asked for before it at once; a resize waits for quiet.
      if (s.frame === null) ctx.requestGrid();
      else ctx.requestGridWhenQuiet();
    },
  };
}
