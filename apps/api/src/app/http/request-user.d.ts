import type { Role } from '@tallyfit/contracts';

declare global {
  namespace Express {
    // The signed-in person that passport-jwt attaches to the request.
    interface User {
      id: number;
      email: string;
      name: string;
      role: Role;
    }
  }
}

export {};
