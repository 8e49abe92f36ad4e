import 'reflect-metadata';
import { DataSource, type MixedList, type EntitySchema } from 'typeorm';
import type { DbConfig } from '../config';
import { PersonEntity } from './entities/person.entity';
import { SessionEntity } from './entities/session.entity';
import { SignInAttemptEntity } from './entities/sign-in-attempt.entity';
import { PeopleAndSessions1764633600000 } from './migrations/1764633600000-people-and-sessions';
import { masterDataEntities } from './entities/master-data-entities';
import { MasterData1764637200000 } from './migrations/1764637200000-master-data';
import { PlanVersionEntity } from './entities/plan-version.entity';
import { ScenarioEntity } from './entities/scenario.entity';
import { SolveJobEntity } from './entities/solve-job.entity';
import { PlanAuditEntity } from './entities/plan-audit.entity';
import { OutboxMessageEntity } from './entities/outbox-message.entity';
import { PlansAndSignOff1764720000000 } from './migrations/1764720000000-plans-and-sign-off';
import { ImportRunEntity } from './entities/import-run.entity';
import { ImportMappingEntity } from './entities/import-mapping.entity';
import { Imports1764806400000 } from './migrations/1764806400000-imports';
import { PlanVersionPlan1764723600000 } from './migrations/1764723600000-plan-version-plan';
import { PersonTokens1764727200000 } from './migrations/1764727200000-person-tokens';
import { PersonTokenEntity } from './entities/person-token.entity';
import { PasswordResetRequestEntity } from './entities/password-reset-request.entity';
import { PasswordResetRequests1764810000000 } from './migrations/1764810000000-password-reset-requests';
import { FirmOrderMustShip1764813600000 } from './migrations/1764813600000-firm-order-must-ship';
import { PersonWorkCenters1764817200000 } from './migrations/1764817200000-person-work-centers';

/** Every entity (EntitySchema objects, no decorators). Areas append theirs here. */
export const entities: EntitySchema<any>[] = [PersonEntity, SessionEntity, SignInAttemptEntity, PlanVersionEntity, ScenarioEntity, SolveJobEntity, PlanAuditEntity, OutboxMessageEntity, PersonTokenEntity, ...masterDataEntities, ImportRunEntity, ImportMappingEntity, PasswordResetRequestEntity];

/** Every migration, in order. Areas append theirs here (timestamps keep the order). */
export const migrations: MixedList<Function> = [PeopleAndSessions1764633600000, MasterData1764637200000, PlansAndSignOff1764720000000, PlanVersionPlan1764723600000, PersonTokens1764727200000, Imports1764806400000, PasswordResetRequests1764810000000, FirmOrderMustShip1764813600000, PersonWorkCenters1764817200000];

/** How long a query may wait for a free pooled connection or a new connection (ms). */
const connectTimeoutMs = 5_000;
/** Connections per API process. */
const poolSize = 10;

/**
 * The one DataSource factory. MariaDB through mysql2 (explicit `connectorPackage`), UTC on the
 * wire (`timezone: 'Z'`), utf8mb4, never `synchronize`. The mysql2 pool drops broken
 * connections and opens new ones on demand, so the API recovers by itself when the DB returns.
 */
export function createDataSource(db: DbConfig): DataSource {
  return new DataSource({
    type: 'mariadb',
    connectorPackage: 'mysql2',
    host: db.host,
    port: db.port,
    database: db.name,
    username: db.user,
    password: db.password,
    charset: 'utf8mb4_unicode_ci',
    timezone: 'Z',
    synchronize: false,
    migrationsRun: false,
    migrationsTransactionMode: 'each',
    entities,
    migrations,
    logging: ['error', 'migration'],
    connectTimeout: connectTimeoutMs,
    extra: {
      connectionLimit: poolSize,
      enableKeepAlive: true,
      keepAliveInitialDelay: 10_000,
      dateStrings: false,
    },
  });
}
