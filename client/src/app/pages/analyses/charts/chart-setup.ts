import { Legend, LinearScale, LineElement, PointElement, ScatterController, Tooltip } from 'chart.js';
import { provideCharts } from 'ng2-charts';

/**
 * The Chart.js parts the analysis charts use, registered by the chart
 * components themselves so Chart.js stays out of every other page's download.
 */
export function provideAnalysisCharts() {
  return provideCharts({ registerables: [ScatterController, LineElement, PointElement, LinearScale, Legend, Tooltip] });
}

/** The product's typeface in the charts too (set per chart: Chart.js defaults are shared with other pages). */
export const CHART_FONT = { family: 'Lato, "Helvetica Neue", Arial, sans-serif', size: 12 } as const;
