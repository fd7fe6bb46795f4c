/**
 * Colours and type of the plots for the light and dark themes. Series colours come from the
 * Okabe & Ito (2008) "Color Universal Design" palette, chosen so the lines stay distinguishable
 * under the common colour-vision deficiencies; the dark theme swaps the darkest ones for lighter
 * members of the same palette so they keep contrast on a dark background.
 */
export type Theme = 'light' | 'dark';

export interface PlotPalette {
  readonly theme: Theme;
  readonly background: string;
  readonly text: string;
  readonly mutedText: string;
  readonly grid: string;
  readonly axis: string;
  /** Candidate / main series colours, in order of use. */
  readonly series: readonly string[];
  /** The logged behaviour's bar and other reference marks. */
  readonly reference: string;
  /** Fill under the policy's action density. */
  readonly densityFill: string;
  /** Shading of the range of actions logged near a state. */
  readonly bandFill: string;
  /** Hatching over never-visited cells: a dark under-stroke and a light over-stroke read on any colour. */
  readonly hatchDark: string;
  readonly hatchLight: string;
  /** Cells whose value is not finite. */
  readonly noValue: string;
  readonly tooltipBackground: string;
  readonly tooltipText: string;
}

const LIGHT: PlotPalette = {
  theme: 'light',
  background: '#ffffff',
  text: '#1b1f24',
  mutedText: '#4b5563',
  grid: 'rgba(27, 31, 36, 0.12)',
  axis: '#6b7280',
  series: ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9'],
  reference: '#6b7280',
  densityFill: 'rgba(0, 114, 178, 0.16)',
  bandFill: 'rgba(107, 114, 128, 0.18)',
  hatchDark: 'rgba(0, 0, 0, 0.6)',
  hatchLight: 'rgba(255, 255, 255, 0.9)',
  noValue: '#9ca3af',
  tooltipBackground: 'rgba(27, 31, 36, 0.94)',
  tooltipText: '#ffffff',
};

const DARK: PlotPalette = {
  theme: 'dark',
  background: '#16181d',
  text: '#e5e7eb',
  mutedText: '#a1a8b3',
  grid: 'rgba(229, 231, 235, 0.14)',
  axis: '#9ca3af',
  series: ['#56B4E9', '#E69F00', '#009E73', '#CC79A7', '#F0E442', '#D55E00'],
  reference: '#a1a8b3',
  densityFill: 'rgba(86, 180, 233, 0.2)',
  bandFill: 'rgba(161, 168, 179, 0.2)',
  hatchDark: 'rgba(0, 0, 0, 0.65)',
  hatchLight: 'rgba(255, 255, 255, 0.85)',
  noValue: '#6b7280',
  tooltipBackground: 'rgba(240, 242, 245, 0.96)',
  tooltipText: '#111318',
};

export function plotPalette(theme: Theme): PlotPalette {
  return theme === 'dark' ? DARK : LIGHT;
}

/**
 * The present controller (what the logs were gathered under) looks the same in every figure of
 * the app, its exports and the report: the palette's reference grey, dashed, under this name.
 */
export const PRESENT_CONTROLLER = 'present controller';

/**
 * The one title of the values chart — J of each candidate beside the baseline — wherever it is shown:
 * the Findings panel's heading and its chart, the PNG/SVG export's default title, the report's caption.
 */
export const VALUES_CHART_TITLE = 'Value of each candidate, J';
/** The discounted return the log itself earned (not a model): beside the baseline as a check, or the baseline where no model of the present controller could be fitted. */
export const LOGGED_RETURN = 'logged return';
/** The logged return where it is shown as the check beside the present controller. */
export const LOGGED_RETURN_LABEL = `${LOGGED_RETURN} (check)`;
export const PRESENT_DASH_PX: readonly number[] = [6, 4];
