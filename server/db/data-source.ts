import 'reflect-metadata';
import path from 'node:path';
import fs from 'node:fs';
import { DataSource } from 'typeorm';
import { loadEnv } from '../env';
import { User } from './entities/user.entity';
import { Production } from './entities/production.entity';
import { Membership } from './entities/membership.entity';
import { Invitation } from './entities/invitation.entity';
import { PasswordReset } from './entities/password-reset.entity';
import { SessionRow } from './entities/session.entity';
import { MailMessage } from './entities/mail-message.entity';
// ENTITY IMPORTS (features add theirs here)
import { Curve } from './entities/curve.entity';
import { Look } from './entities/look.entity';
import { Swatch } from './entities/swatch.entity';
import { Board } from './entities/board.entity';
import { Photo } from './entities/photo.entity';
import { ActivityEntry } from './entities/activity.entity';
import { Init1764625000000 } from './migrations/1764625000000-init';
// MIGRATION IMPORTS (features add theirs here)
import { BenchBoards1764628004000 } from './migrations/1764628004000-bench-boards';
import { Photos1764627005000 } from './migrations/1764627005000-photos';
import { SwatchLightStops1796180652802 } from './migrations/1796180652802-swatch-light-stops';
import { Activity1796186908164 } from './migrations/1796186908164-activity';
import { HashedSessions1796187000000 } from './migrations/1796187000000-hashed-sessions';

export const entities = [
  User, Production, Membership, Invitation, PasswordReset, SessionRow, MailMessage,
  // ENTITIES
  Curve, Look, Swatch, Board,
  Photo,
  ActivityEntry,
];
export const migrations = [
  Init1764625000000,
  // MIGRATIONS
  BenchBoards1764628004000,
  Photos1764627005000,
  SwatchLightStops1796180652802,
  Activity1796186908164,
  HashedSessions1796187000000,
];

/**
 * SQLite through better-sqlite3: WAL, a busy timeout and foreign keys on; schema by migrations, never synchronize.
 * The same entities run on PostgreSQL given `type: 'postgres'` and a URL (migrations would then be generated for it).
 */
export function createDataSource(dbFile: string): DataSource {
  fs.mkdirSync(path.dirname(dbFile), { recursive: true });
  return new DataSource({
    type: 'better-sqlite3',
    database: dbFile,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    enableWAL: true,
    prepareDatabase: (db: { pragma: (s: string) => unknown }) => {
      db.pragma('busy_timeout = 5000');
      db.pragma('foreign_keys = ON');
    },
  });
}

/** Used by the TypeORM CLI (npm run migration:generate / migration:run). */
export default createDataSource(path.join(loadEnv().dataDir, 'app.sqlite'));
