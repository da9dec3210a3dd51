import { useEffect, useState, type RefObject } from 'react';
import type { PixelSize } from '../plot';

/** The CSS size of an element, following resizes. */
export function useElementSize(ref: RefObject<HTMLElement | null>): PixelSize | null {
  const [size, setSize] = useState<PixelSize | null>(null);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const observer = new ResizeObserver(([entry]) => {
      const { width, height } = entry.contentRect;
      if (width > 0 && height > 0) setSize((old) => (old && old.width === Math.round(width) && old.height === Math.round(height) ? old : { width: Math.round(width), height: Math.round(height) }));
    });
    observer.observe(el);
    return () => observer.disconnect();
  }, [ref]);
  return size;
}

/** Sizes a canvas backing store for the device pixel ratio and returns a context scaled to CSS pixels. */
export function prepareCanvas(canvas: HTMLCanvasElement, size: PixelSize): CanvasRenderingContext2D | null {
  const ratio = window.devicePixelRatio || 1;
  const w = Math.round(size.width * ratio);
  const h = Math.round(size.height * ratio);
  if (canvas.width !== w || canvas.height !== h) {
    canvas.width = w;
    canvas.height = h;
  }
  const ctx = canvas.getContext('2d');
  if (!ctx) return null;
  ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
  return ctx;
}
