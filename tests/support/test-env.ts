/**
 * What `npm test` hands to every test process (dev-services/test-run.ts sets these): the test
 * cluster, the migrated template database, the mail stand-in, the S3 stand-in and the payments
 * stand-in.
 */
function required(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: run the tests through \`npm test\`, which starts the test services.`);
  return value;
}

export const testEnv = {
  get clusterUrl() {
    return required("KERF_TEST_CLUSTER_URL");
  },
  get templateDatabase() {
    return required("KERF_TEST_TEMPLATE_DB");
  },
  get smtpPort() {
    return Number(required("KERF_TEST_SMTP_PORT"));
  },
  get mailWebUrl() {
    return required("KERF_TEST_MAIL_WEB_URL");
  },
  /** The S3 stand-in (dev-services/s3.ts): one bucket shared by every test file; keys never collide. */
  get s3() {
    return {
      endpoint: required("KERF_TEST_S3_ENDPOINT"),
      bucket: required("KERF_TEST_S3_BUCKET"),
      accessKeyId: required("KERF_TEST_S3_ACCESS_KEY_ID"),
      secretAccessKey: required("KERF_TEST_S3_SECRET_ACCESS_KEY"),
    };
  },
  /**
   * The payments stand-in (dev-services/payments/): its URL, the default account's secret key and
   * webhook signing secret. A test file that wants objects of its own makes its own account
   * (tests/support/payments.ts, createPaymentsAccount).
   */
  get payments() {
    return {
      apiUrl: required("KERF_TEST_PAYMENTS_API_URL"),
      secretKey: required("KERF_TEST_PAYMENTS_SECRET_KEY"),
      webhookSecret: required("KERF_TEST_PAYMENTS_WEBHOOK_SECRET"),
    };
  },
};
