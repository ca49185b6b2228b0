import { convert } from '@/lib/preserving';
import { toolRoute } from '@/lib/preserving/http';
import { toolQueries } from '@/lib/validations/tools';

/** GET /api/tools/convert?value&from&to — exact conversion between units of the same kind. */
export const GET = toolRoute(toolQueries.convert, ({ value, from, to }) => ({ value: convert(value, from, to), from, to }));
