"""Suite-wide settings: hypothesis runs derandomized (a fixed seed per test, no example database),
so a run's outcome never depends on an earlier run or on chance."""

from hypothesis import settings

settings.register_profile("deterministic", derandomize=True, database=None, print_blob=True)
settings.load_profile("deterministic")
