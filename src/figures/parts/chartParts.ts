/**
 * The Chart.js parts our plots use. Chart.js is tree-shaken, so controllers, scales, elements and
 * plugins must be registered before a chart of that kind is made; registering twice is harmless.
 */
import {
  BarController, BarElement, CategoryScale, Chart, Filler, Legend, LinearScale, LineController, LineElement,
  LogarithmicScale, PointElement, ScatterController, SubTitle, Title, Tooltip,
} from 'chart.js';

export function registerChartParts(): void {
  Chart.register(
    ScatterController, LineController, BarController, LinearScale, LogarithmicScale, CategoryScale,
    PointElement, LineElement, BarElement, Filler, Legend, Title, SubTitle, Tooltip,
  );
}
