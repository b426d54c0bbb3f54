"""Two bearings the internal-analysis tests share: a deep-groove ball bearing and a cylindrical
roller bearing with straight rollers, each at zero clearance under pure radial load."""

from __future__ import annotations

from workbench.engine.internal.distribution import InternalInputs

BALL = InternalInputs("deep-groove", 9, 12.7, 65.0, fr=5000.0)
ROLLER = InternalInputs("cylindrical", 14, 11.0, 70.0, lwe=11.0, fr=20000.0, profile="straight")
