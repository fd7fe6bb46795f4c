/**
 * A small histogram drawn straight on a canvas (bins of equal width, bar height ∝ count), sharp
 * at any zoom: the canvas is sized in device pixels. Its colour follows the theme's --bar.
 */
import { useEffect, useRef } from 'react';
import type { Histogram as HistogramData } from '../../../data/columnStatistics';
import { useStore } from '../state/useStore';
import { themeStore, type Theme } from '../theme';

const same = (t: Theme) => t;

export function Histogram(props: { histogram: HistogramData; label: string }) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const theme = useStore(themeStore, same);
  useEffect(() => {
    const c = canvas.current;
    const context = c?.getContext('2d');
    if (!c || !context) return;
    const ratio = window.devicePixelRatio || 1;
    const width = c.clientWidth * ratio, height = c.clientHeight * ratio;
    c.width = width;
    c.height = height;
    context.clearRect(0, 0, width, height);
    context.fillStyle = getComputedStyle(c).getPropertyValue('--bar').trim() || '#6b8fb8';
    const { counts } = props.histogram;
    const most = Math.max(1, ...counts);
    const bar = width / counts.length;
    counts.forEach((count, i) => {
      const h = (count / most) * (height - ratio);
      context.fillRect(i * bar + ratio * 0.5, height - h, Math.max(ratio, bar - ratio), h);
    });
  }, [props.histogram, theme]);
  const { edges } = props.histogram;
  return (
    <canvas
      ref={canvas} className="histogram" role="img"
      aria-label={`Histogram of ${props.label} from ${edges[0]} to ${edges[edges.length - 1]} in ${props.histogram.counts.length} bins`}
    />
  );
}
