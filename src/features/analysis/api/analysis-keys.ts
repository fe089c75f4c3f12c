import type { CornerOrAxle, ScatterMetric, ScatterParam } from '@shared/analysis/analysis.schema';

/** What a scatter plot asks the server for: one setup value against one measurement. */
export interface ScatterRequest {
  x: ScatterParam;
  y: ScatterMetric;
  corner: CornerOrAxle;
}

/** Every analysis query key; each holds every variable its request uses. */
export const analysisKeys = {
  all: ['analysis'] as const,
  ofCar: (carId: string) => [...analysisKeys.all, 'car', carId] as const,
  scatter: (carId: string, request: ScatterRequest) => [...analysisKeys.ofCar(carId), 'scatter', request] as const,
  compare: (carId: string, changeId: string) => [...analysisKeys.ofCar(carId), 'compare', changeId] as const,
  season: (carId: string, minDepthMm: number) => [...analysisKeys.ofCar(carId), 'season', { minDepthMm }] as const,
};
