import type { ActivityEntry, CurrentUser, Page } from '@cc/shared';
import type { ActivityQuerySchema } from '@cc/shared';
import type { z } from 'zod';
import type { RequestsService } from '../requests/requests.service';
import type { ActivityRepository } from './activity.repository';

export class ActivityService {
  constructor(
    private readonly access: RequestsService,
    private readonly activity: ActivityRepository,
  ) {}

  /** The timeline of a request the user may see (404 otherwise). */
  async list(user: CurrentUser, requestId: number, query: z.output<typeof ActivityQuerySchema>): Promise<Page<ActivityEntry>> {
    await this.access.get(user, requestId);
    const { items, total } = await this.activity.list(requestId, query.kind, query.page, query.pageSize);
    return { items, total, page: query.page, pageSize: query.pageSize };
  }
}
