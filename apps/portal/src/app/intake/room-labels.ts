// Rooms as people say them: one list, in the shared package (the quote PDF uses it too).
export { ROOM_LABELS } from '@cc/shared';
