export interface WeatherRange {
  from?: string;
  to?: string;
}

export const weatherKeys = {
  all: ['weather'] as const,
  garden: (gardenId: number) => ['weather', gardenId] as const,
  days: (gardenId: number, range: WeatherRange) => ['weather', gardenId, 'days', range] as const,
  runs: (gardenId: number) => ['weather', gardenId, 'runs'] as const,
};
