/**
 * Addresses of one record's pages that only other pages (not the event day nor Home) link to, kept out of
 * the first download; the rest are `pathTo` in `paths.ts`.
 */
/** On a car's page: show its edit page instead. */
export const EDIT_PARAM = 'edit';

export const recordPath = {
  review: (carId: string) => `/cars/${carId}/review`,
  /** The car's own details (name, class, adjusters), and deleting it: its owner only. */
  editCar: (carId: string) => `/cars/${carId}?${EDIT_PARAM}=1`,
  /** Fix a setup the server refused: the editor reopens the stored entry. */
  fixSetup: (carId: string, entryKey: string) => `/cars/${carId}/setups/new?fix=${encodeURIComponent(entryKey)}`,
  tread: (carId: string, tyreSetId?: string | null) =>
    `/cars/${carId}/tread${tyreSetId ? `?set=${encodeURIComponent(tyreSetId)}` : ''}`,
  shopCustomer: (carId: string) => `/shop/customers/${carId}`,
  /** Under the shop's customer page: only shop staff suggest, and the shop's tab stays the current one. */
  newSuggestion: (carId: string, baseSetupId?: string | null) =>
    `/shop/customers/${carId}/suggestions/new${baseSetupId ? `?from=${encodeURIComponent(baseSetupId)}` : ''}`,
  suggestion: (suggestionId: string) => `/suggestions/${suggestionId}`,
  workOrder: (workOrderId: string) => `/work-orders/${workOrderId}`,
  invoice: (invoiceId: string) => `/invoices/${invoiceId}`,
  team: (teamId: string) => `/teams/${teamId}`,
  classBoard: (teamId: string) => `/teams/${teamId}/board`,
  /** Timing-sheet import for one car, optionally at a chosen event. */
  importResults: (carId: string, eventId?: string | null) =>
    `/cars/${carId}/import${eventId ? `?eventId=${encodeURIComponent(eventId)}` : ''}`,
  /** Season export: one setup snapshot as a printable sheet. */
  setupSheet: (setupId: string) => `/setups/${setupId}/sheet`,
};
