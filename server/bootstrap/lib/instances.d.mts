export interface MariadbInstance {
  port: number;
  socketPath: string;
  startedHere: boolean;
  runSql(sql: string): string;
  stop(): Promise<void>;
}

export function startDevDatabase(): Promise<{ instance: MariadbInstance; url: string }>;
export function startTestDatabaseServer(): Promise<{ instance: MariadbInstance; url: string }>;

export interface TestDatabaseLease {
  url: string;
  port: number;
  runSql(sql: string): string;
  release(): Promise<void>;
}

export function acquireTestDatabaseServer(): Promise<TestDatabaseLease>;
