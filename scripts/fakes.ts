// `npm run fakes`: the local mail and payment fakes on their own, for running the server elsewhere.
await import('../fakes/mail/main.ts');
await import('../fakes/stripe/main.ts');

export {};
