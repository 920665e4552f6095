# shellcheck shell=bash
# What every runner (demo, test, bench) sources first: the helpers, the environments, PostgreSQL, the app,
# the design-search workers, the object store and the mail catcher lifecycles, stopping on signals, then the working directory set to the repo.
# shellcheck source=scripts/lib/common.sh
source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
# shellcheck source=scripts/lib/env.sh
source "$KB_ROOT/scripts/lib/env.sh"
# shellcheck source=scripts/lib/pg.sh
source "$KB_ROOT/scripts/lib/pg.sh"
# shellcheck source=scripts/lib/app.sh
source "$KB_ROOT/scripts/lib/app.sh"
# shellcheck source=scripts/lib/object-store.sh
source "$KB_ROOT/scripts/lib/object-store.sh"
# shellcheck source=scripts/lib/mail-catcher.sh
source "$KB_ROOT/scripts/lib/mail-catcher.sh"
# shellcheck source=scripts/lib/workers.sh
source "$KB_ROOT/scripts/lib/workers.sh"
# shellcheck source=scripts/lib/signals.sh
source "$KB_ROOT/scripts/lib/signals.sh"
cd "$KB_ROOT"
