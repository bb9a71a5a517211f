/** What `attempt` throws, or undefined when it returns normally (so a test can check the error's type and code). */
export function thrownBy(attempt: () => unknown): unknown {
  try {
    attempt();
  } catch (error) {
    return error;
  }
  return undefined;
}
