/*
 * The one module of the teams feature that imports chart.js. The class board loads it with
 * React.lazy, so chart.js arrives in its own chunk, only when a board with a trend is opened.
 */
import { Chart as ChartJS, LinearScale, LineElement, PointElement, ScatterController, Tooltip, type ChartOptions } from 'chart.js';
import { Scatter } from 'react-chartjs-2';

ChartJS.register(ScatterController, LinearScale, PointElement, LineElement, Tooltip);

function themeColour(name: string, fallback: string): string {
  if (typeof window === 'undefined') return fallback;
  const value = window.getComputedStyle(document.documentElement).getPropertyValue(`--sl-${name}`).trim();
  return value || fallback;
}

export interface TrendPoint {
  /** The car's n-th event of the season, from 1. */
  x: number;
  /** % off the class's fastest adjusted time that day. */
  y: number;
  /** The event's day on the axis ("12 Jun"). */
  tick: string;
  label: string;
}

/** A small line: % off the class's fastest, event by event (lower is closer). */
export function TrendChart({ points, summary }: { points: TrendPoint[]; summary: string }) {
  const ink = themeColour('ink', '#131a24');
  const muted = themeColour('ink-muted', '#4a5566');
  const grid = themeColour('line', '#d3dae3');
  const accent = themeColour('accent', '#0d6b66');
  const options: ChartOptions<'scatter'> = {
    animation: false,
    maintainAspectRatio: false,
    plugins: {
      legend: { display: false },
      tooltip: { callbacks: { label: (item) => points[item.dataIndex]?.label ?? '' } },
    },
    scales: {
      x: {
        type: 'linear',
        min: 0.5,
        max: points.length + 0.5,
        title: { display: true, text: 'Event', color: ink },
        // One tick per event, named by its day. Left to itself, Chart.js steps from the padded end (0.5, 1.5, …).
        afterBuildTicks: (scale) => {
          scale.ticks = points.map((_, i) => ({ value: i + 1 }));
        },
        ticks: { color: muted, callback: (value) => points[Number(value) - 1]?.tick ?? '' },
        grid: { display: false },
      },
      y: {
        type: 'linear',
        reverse: true,
        beginAtZero: true,
        title: { display: true, text: '% off', color: ink },
        ticks: { color: muted, maxTicksLimit: 4 },
        grid: { color: grid },
      },
    },
  };
  return (
    <div className="relative h-32 w-full max-w-sm">
      <Scatter
        data={{
          datasets: [
            {
              label: '% off the class’s fastest',
              data: points.map((p) => ({ x: p.x, y: p.y })),
              showLine: true,
              borderColor: accent,
              backgroundColor: accent,
              pointRadius: 4,
              pointHitRadius: 10,
              borderWidth: 2,
            },
          ],
        }}
        options={options}
        role="img"
        aria-label={summary}
      />
    </div>
  );
}
