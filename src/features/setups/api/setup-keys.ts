export const setupKeys = {
  all: ['setups'] as const,
  ofCar: (carId: string) => [...setupKeys.all, 'car', carId] as const,
};
