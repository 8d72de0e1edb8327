import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { GetObjectCommand, ListBucketsCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startObjectStore, type ObjectStore } from './object-store-server';

describe('object store', () => {
  let dir: string;
  let store: ObjectStore;
  let client: S3Client;

  beforeAll(async () => {
    dir = await mkdtemp(join(tmpdir(), 'limbus-s3-'));
    store = await startObjectStore({ port: 0, directory: dir, bucket: 'limbus-test' });
    client = new S3Client({
      endpoint: store.endpoint,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    });
  });

  afterAll(async () => {
    client.destroy();
    await store.close();
    await rm(dir, { recursive: true, force: true });
  });

  it('startObjectStore() creates the configured bucket', async () => {
    const buckets = await client.send(new ListBucketsCommand({}));
    expect(buckets.Buckets?.map((b) => b.Name)).toEqual(['limbus-test']);
  });

  it('startObjectStore() returns the bytes and content type of an object put with the AWS SDK', async () => {
    const body = 'station,disappearance_utc\nNorth Ridge,2026-03-14T02:11:07.412Z\n';
    await client.send(
      new PutObjectCommand({
        Bucket: 'limbus-test',
        Key: 'events/e1/timings.csv',
        Body: body,
        ContentType: 'text/csv',
      }),
    );
    const got = await client.send(
      new GetObjectCommand({ Bucket: 'limbus-test', Key: 'events/e1/timings.csv' }),
    );
    expect(got.ContentType).toBe('text/csv');
    expect(await got.Body?.transformToString()).toBe(body);
  });

  it('startObjectStore() answers NoSuchKey for a missing object', async () => {
    await expect(
      client.send(new GetObjectCommand({ Bucket: 'limbus-test', Key: 'missing' })),
    ).rejects.toMatchObject({
      name: 'NoSuchKey',
    });
  });
});
