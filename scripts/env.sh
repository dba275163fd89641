# Sourced by every shell script first: the variables of the checkout's .env that the environment
# does not set yet (one loader for every program: lib/settings/env-file.mjs).
eval "$(node "$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)/lib/settings/env-file.mjs" "$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)/.env")"
