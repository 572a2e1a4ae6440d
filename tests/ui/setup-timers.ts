import { timeoutManager } from "@tanstack/react-query";

/*
 * TanStack Query keeps an unused query for its gcTime (5 minutes) with a timer; in a test run
 * those timers would hold the worker open for five minutes after the last test. Timers that do
 * not hold the process open behave the same for the tests and let jest exit when they are done.
 */
const unref = <T>(id: T): T => {
  (id as { unref?: () => void }).unref?.();
  return id;
};

timeoutManager.setTimeoutProvider({
  setTimeout: (cb, ms) => unref(setTimeout(cb, ms)) as unknown as number,
  clearTimeout: (id) => clearTimeout(id as unknown as NodeJS.Timeout),
  setInterval: (cb, ms) => unref(setInterval(cb, ms)) as unknown as number,
  clearInterval: (id) => clearInterval(id as unknown as NodeJS.Timeout),
});
