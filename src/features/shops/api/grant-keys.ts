/**
 * Keys of what the car page asks about shops (its grants, the shop search). Apart from shop-keys.ts,
 * so the car page and the shop page share no file for it.
 */
export const grantKeys = {
  all: ['shop-grants'] as const,
  ofCar: (carId: string) => [...grantKeys.all, 'car', carId] as const,
  search: (q: string) => [...grantKeys.all, 'shop-search', q] as const,
};
