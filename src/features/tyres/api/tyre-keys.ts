export const tyreKeys = {
  all: ['tyres'] as const,
  setsOfCar: (carId: string) => [...tyreKeys.all, 'sets', carId] as const,
  readings: (tyreSetId: string) => [...tyreKeys.all, 'readings', tyreSetId] as const,
};
