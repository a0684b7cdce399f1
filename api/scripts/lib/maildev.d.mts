// Types for maildev.mjs, for the tests that start their own mail sink.
export interface MailSink {
  smtpPort: number;
  webPort: number;
  webUrl: string;
  startedByUs: boolean;
  stop(): Promise<void>;
}

export declare function startMailSink(options: {
  root: string;
  smtpPort: number;
  webPort: number;
  stateFile?: string;
  logFile: string;
}): Promise<MailSink>;
