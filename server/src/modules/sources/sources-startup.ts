import path from 'node:path';
import type { AppConfig } from '../../config/env';
import { LOCAL_S3_KEY } from '../../config/env';
import { PROJECT_ROOT } from '../../config/paths';
import type { Logger } from '../../lib/logger';

export interface LocalSourceServices {
  /** The configuration with the local stand-ins filled in where nothing was configured. */
  config: AppConfig;
  stop(): Promise<void>;
}

/**
 * Outside production, starts on loopback what sources need and nobody configured: the fake DOI
 * metadata service (DOI_BASE_URL unset) and the local S3 stand-in (S3_URL unset), whose objects
 * are kept under .data/s3 between runs. In production nothing is started.
 */
export async function startLocalSourceServices(
  config: AppConfig,
  logger: Logger,
): Promise<LocalSourceServices> {
  const stops: (() => Promise<void>)[] = [];
  let next = config;
  if (config.env !== 'production' && !config.doiBaseUrl) {
    // Development code, loaded only when asked for: the production bundle does not contain it.
    const { startFakeDoi } = await import('../../fakes/doi-fake');
    const doi = await startFakeDoi({ port: config.fakeDoiPort });
    stops.push(doi.stop);
    next = { ...next, doiBaseUrl: doi.url };
    logger.info({ url: doi.url }, 'local fake DOI metadata service started (loopback only)');
  }
  if (config.env !== 'production' && !config.fileStore) {
    const bucket = 'thalpos-documents';
    const { startFakeS3 } = await import('../../fakes/s3-fake');
    const s3 = await startFakeS3({
      port: config.fakeS3Port,
      bucket,
      directory: path.join(PROJECT_ROOT, '.data', 's3'),
    });
    stops.push(s3.stop);
    next = {
      ...next,
      fileStore: {
        endpoint: s3.url,
        bucket,
        region: 'us-east-1',
        accessKeyId: LOCAL_S3_KEY,
        secretAccessKey: LOCAL_S3_KEY,
      },
    };
    logger.info({ url: s3.url }, 'local S3 stand-in started (loopback only), files in .data/s3');
  }
  if (!next.fileStore) logger.warn('S3_URL is not set: documents cannot be attached to sources');
  return {
    config: next,
    stop: async () => {
      await Promise.all(stops.map((stop) => stop()));
    },
  };
}
