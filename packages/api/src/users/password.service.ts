import { hash, verify } from '@node-rs/argon2';
import { Injectable } from '@nestjs/common';

/**
 * argon2id with the OWASP Password Storage Cheat Sheet's first recommended setting
 * (m = 19 MiB, t = 2, p = 1).
 */
// The library's Algorithm enum is an ambient const enum, unusable under isolatedModules; 2 = Argon2id.
const ARGON2ID = 2;
const OPTIONS = { algorithm: ARGON2ID, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

@Injectable()
export class PasswordService {
  hash(password: string): Promise<string> {
    return hash(password, OPTIONS);
  }

  async verify(passwordHash: string, password: string): Promise<boolean> {
    try {
      return await verify(passwordHash, password);
    } catch {
      return false;
    }
  }

  /**
   * Verifies against a throwaway hash so that an unknown e-mail costs as long as a wrong
   * password; otherwise response time tells which accounts exist.
   */
  private dummyHash: Promise<string> | null = null;
  async burn(password: string): Promise<void> {
    this.dummyHash ??= this.hash('limbus-timing-equaliser');
    await this.verify(await this.dummyHash, password);
  }
}
