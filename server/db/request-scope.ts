/**
 * A continuation-local namespace on Node's AsyncLocalStorage, in the shape Sequelize's `useCLS`
 * expects (get/set/run/bind). With it, every model query made while a request's transaction is
 * open joins that transaction by itself, so the tenant setting made at its start applies to
 * every statement (see tenancy/tenant-transaction.ts).
 */
import { AsyncLocalStorage } from 'node:async_hooks';

type Context = Map<string, unknown>;

const storage = new AsyncLocalStorage<Context>();

export const requestScope = {
  get(key: string): unknown {
    return storage.getStore()?.get(key);
  },
  set(key: string, value: unknown): void {
    storage.getStore()?.set(key, value);
  },
  run<T>(fn: (context: Context) => T): T {
    const context: Context = new Map(storage.getStore() ?? []);
    return storage.run(context, () => fn(context));
  },
  bind<F extends (...args: never[]) => unknown>(fn: F): F {
    return AsyncLocalStorage.bind(fn) as F;
  },
};
