export const changeKeys = {
  all: ['changes'] as const,
  ofCar: (carId: string) => [...changeKeys.all, 'car', carId] as const,
};
