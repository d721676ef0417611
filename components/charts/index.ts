// Chart components and helpers for the swing views.
export { TimeSeriesChart, type TimeSeriesChartProps, type EventDragHandlers } from './time-series-chart';
export { LeadShareChart, HeelShareChart, CopSpeedChart, type SwingChartProps } from './swing-charts';
export { StancePathChart, type StancePathChartProps, type SensorFrames } from './stance-path-chart';
export { ValuesPanel, type ValuesPanelProps } from './values-panel';
export { ChartTable, type ChartTableProps, type TableColumn } from './chart-table';
export { ChartLegend, type LegendItem } from './chart-legend';
export { SwingTraceViewer, zoomDomain, type SwingTraceViewerProps, type ZoomLevel } from './swing-trace-viewer';
export { traceSeriesSchema, sensorFramesSchema } from './lib/series-schema';
export { bandOnTime, type ReferenceBand } from './lib/bands';
export { alignOverlay, type OverlayTrace } from './lib/overlay';
export type { TraceSeries, SwingEvents, TimeWindow, TimeBand, LineSpec, NumArray } from './lib/types';
