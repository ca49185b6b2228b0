/**
 * When BRINEWRIGHT_PARENT_PID is set (the browser tests set it to their own pid), calls `stop` once
 * that process has gone, so a killed test run leaves no fake or worker holding its ports.
 */
export function watchParent(stop: () => void, everyMs = 1000): void {
  const pid = Number(process.env.BRINEWRIGHT_PARENT_PID);
  if (!Number.isInteger(pid) || pid <= 0) return;
  const timer = setInterval(() => {
    try {
      process.kill(pid, 0);
    } catch {
      clearInterval(timer);
      stop();
    }
  }, everyMs);
  timer.unref();
}
