"""The workbench screen: Textual widgets that display and edit one document."""

import os

# Textual paints at most TEXTUAL_FPS frames a second (60 by default), on a timer: the frame that
# shows a key's result waited up to two periods for its turn, about half of the 50–60 ms from a
# key to the settled screen (`workbench bench`, settle_ms_p90).  At 120 the same keys settle in
# 32–44 ms (median, demo session, idle 2-core machine).  Frames are still drawn only when
# something changed; a TEXTUAL_FPS the person set is kept.
os.environ.setdefault("TEXTUAL_FPS", "120")
