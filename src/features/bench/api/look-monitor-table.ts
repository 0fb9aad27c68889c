import { apiPaths } from '../../../lib/paths';
import type { MonitorTableFormat } from '../../../../shared/look/monitor-table';

/** A saved look's monitoring table (cube or CLF) as a plain download link: the session cookie goes with it. */
export const lookMonitorTableUrl = (pid: number, lookId: number, format: MonitorTableFormat, size: number) =>
  apiPaths.production(pid).look(lookId).lut({ format, size });
