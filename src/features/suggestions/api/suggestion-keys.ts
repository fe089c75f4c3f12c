/** Every suggestion query key. */
export const suggestionKeys = {
  all: ['suggestions'] as const,
  ofCar: (carId: string) => [...suggestionKeys.all, 'car', carId] as const,
  detail: (suggestionId: string) => [...suggestionKeys.all, 'detail', suggestionId] as const,
  /** The open suggestions on the user's own cars. */
  waiting: () => [...suggestionKeys.all, 'waiting'] as const,
};
