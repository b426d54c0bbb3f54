"""Inside the bearing: Hertz contact (:mod:`.hertz`), the load distribution over the rolling
elements by the quasi-static ring-displacement equilibrium (:mod:`.distribution`), the reference
rating life from the element loads in the manner of ISO/TS 16281 (:mod:`.reference_life`), and
the recorded analysis of one bearing that the command, the screen and the benchmark call
(:mod:`.analysis`: ``analyse_internal``, ``clearance_sweep``)."""
