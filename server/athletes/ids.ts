export { requireUuid } from '@/server/http/ids';
