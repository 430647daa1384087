import { HttpContextToken } from '@angular/common/http';

/**
 * Whether the caller deals with a 401 itself (sign-in with wrong credentials, the start-up session
 * check) instead of the interceptor sending the visitor to the sign-in page.
 */
export const HANDLES_UNAUTHORISED = new HttpContextToken<boolean>(() => false);
