#!/usr/bin/env bash
# Build a release APK for arm64-v8a with cargo-apk. Checks the tools first and says
# what is missing and how to get it. Signing comes from the environment:
#   CARGO_APK_RELEASE_KEYSTORE=/path/to/release.keystore
#   CARGO_APK_RELEASE_KEYSTORE_PASSWORD=...
# Never commit a keystore or its password.
set -euo pipefail
cd "$(dirname "$0")/.."

TARGET=aarch64-linux-android
API=35
missing=0
say() { echo "missing: $*" >&2; missing=1; }

sdk="${ANDROID_HOME:-${ANDROID_SDK_ROOT:-}}"
if [ -z "$sdk" ] || [ ! -d "$sdk" ]; then
    say "Android SDK. Install the command-line tools, then: sdkmanager \"platforms;android-$API\" \"build-tools;35.0.0\"; export ANDROID_HOME=<sdk dir>"
else
    [ -f "$sdk/platforms/android-$API/android.jar" ] ||
        say "android.jar for API $API: sdkmanager \"platforms;android-$API\""
    if ! ls "$sdk"/build-tools/*/d8 >/dev/null 2>&1; then
        say "build-tools with d8: sdkmanager \"build-tools;35.0.0\""
    fi
fi
ndk="${ANDROID_NDK_ROOT:-${ANDROID_NDK_HOME:-}}"
if [ -z "$ndk" ] || [ ! -d "$ndk/toolchains/llvm" ]; then
    say "Android NDK: sdkmanager \"ndk;27.2.12479018\"; export ANDROID_NDK_ROOT=\$ANDROID_HOME/ndk/27.2.12479018"
fi
if ! java -version 2>&1 | grep -q 'version "17'; then
    say "JDK 17 (apt-get install openjdk-17-jdk-headless)"
fi
if ! rustup target list --installed 2>/dev/null | grep -qx "$TARGET"; then
    say "Rust target: rustup target add $TARGET"
fi
if ! cargo apk --help >/dev/null 2>&1; then
    say "cargo-apk: cargo install cargo-apk"
fi
if [ -z "${CARGO_APK_RELEASE_KEYSTORE:-}" ]; then
    echo "note: CARGO_APK_RELEASE_KEYSTORE is not set; cargo-apk signs with its debug key (not for release)." >&2
fi
if [ "$missing" -ne 0 ]; then
    echo "Cannot build the APK until the above is installed." >&2
    exit 1
fi

# Small and stripped for the phone; the desktop release profile stays as it is.
export CARGO_PROFILE_RELEASE_OPT_LEVEL=s
export CARGO_PROFILE_RELEASE_STRIP=true
export CARGO_PROFILE_RELEASE_LTO=true
cargo apk build --release --lib --target "$TARGET"
apk=$(ls -t target/release/apk/*.apk 2>/dev/null | head -n1 || true)
if [ -n "$apk" ]; then
    echo "APK: $apk"
    echo "Install: adb install -r $apk"
else
    echo "cargo apk finished, but no APK was found under target/release/apk/" >&2
    exit 1
fi
