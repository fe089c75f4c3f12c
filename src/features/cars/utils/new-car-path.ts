import { paths } from '@/config/paths';

/** The cars page opens its new-car form with this search parameter (`/cars?new=1`). */
export const NEW_CAR_PARAM = 'new';

/** Where "New car" leads. */
export const NEW_CAR_PATH = `${paths.cars}?${NEW_CAR_PARAM}=1`;
