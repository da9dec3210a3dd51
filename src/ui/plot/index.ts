// The drawing kernels of the plot: data + scales in, values out or drawing on a context passed in.
export * from './scales';
export * from './grid-space';
export * from './context';
export * from './colour';
export * from './legend';
export * from './run-style';
export * from './markers';
export * from './contours';
export * from './axes';
export * from './arrows';
export * from './trajectory';
export * from './svg';
export * from './chart-frame';
export * from './text-fit';
