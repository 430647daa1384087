/** The caution shown once on every screen of on-site work and on the completion letter (the product's wording). */
export const WORK_SAFETY_CAUTION =
  'Electrical work can cause shock, burns, fire and death. Before work, de-energise the circuit and verify the absence ' +
  'of voltage with a tester proven on a live source, before and after. Only persons licensed for electrical work where ' +
  'it is performed may do it; the local code, its permits and the authority having jurisdiction govern.';
