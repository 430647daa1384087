import * as z from 'zod';
import { REQUEST_STATUSES } from './request-status';

export const RequestStatusSchema = z.enum(REQUEST_STATUSES);
