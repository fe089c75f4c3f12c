/**
 * The two pages holding the car form, a new car's and an existing car's, in one chunk loaded when either is
 * opened: the cars list and a car's page each import it lazily, so neither carries the form.
 */
export { NewCarPage } from './new-car';
export { EditCarPage } from './edit-car';
