# Installs the independent G-code reader (tests/node/package-lock.json) for
# the read-back tests, when it is not installed already.
#   cmake -DNODE_DIR=tests/node -DNPM=/usr/bin/npm -P install_modules.cmake
# node_modules/.dovetailor-lock holds the SHA-256 of the package-lock.json it
# was installed from; when it matches, nothing runs (no network needed).
# Otherwise `npm ci --prefer-offline` installs exactly the locked versions,
# from npm's cache when it has them.
file(SHA256 ${NODE_DIR}/package-lock.json lock)
set(stamp ${NODE_DIR}/node_modules/.dovetailor-lock)
if(EXISTS ${stamp})
  file(READ ${stamp} installed)
  if(installed STREQUAL lock)
    message(STATUS "tests/node: node_modules is up to date")
    return()
  endif()
endif()
if(NOT NPM)
  message(FATAL_ERROR "npm not found: install Node.js and npm (Debian nodejs, npm; bash .ci/install-deps)")
endif()
execute_process(COMMAND ${NPM} ci --prefix ${NODE_DIR} --prefer-offline --no-audit --no-fund
                        --silent
                RESULT_VARIABLE code)
if(NOT code EQUAL 0)
  message(FATAL_ERROR "npm ci --prefix ${NODE_DIR} failed (exit ${code}); the read-back tests "
                      "need the npm package gcode-parser (tests/node/package.json)")
endif()
file(WRITE ${stamp} ${lock})
message(STATUS "tests/node: installed the locked packages")
