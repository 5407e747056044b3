//! Android's clipboard and shared Downloads, through the Java framework (JNI): the plan as
//! text onto the clipboard, and the team card into Downloads/Turnsheet through the media
//! store, which needs no permission from Android 10 (API 29) on. Kept thin: every call is
//! one framework method, and every Java exception becomes an error in words (the caller
//! falls back and says so). Built only for Android; it cannot be run in the desktop
//! tests, so the session reaches it only through `Exchange::publish_card` and the
//! clipboard's `put_text`, whose desktop fallbacks are tested.

use jni::JNIEnv;
use jni::objects::{JObject, JValue};

/// The folder under Downloads that cards go into.
pub const DOWNLOADS_FOLDER: &str = "Turnsheet";

/// Run `f` with the activity's JNI environment and context; a pending Java exception is
/// cleared and described.
fn with_context<T>(
    f: impl FnOnce(&mut JNIEnv, &JObject) -> jni::errors::Result<T>,
) -> Result<T, String> {
    let ctx = ndk_context::android_context();
    // SAFETY: android-activity sets the process's JavaVM and the activity (a Context)
    // before `android_main` runs, and both outlive the app's window.
    let vm = unsafe { jni::JavaVM::from_raw(ctx.vm().cast()) }.map_err(|e| e.to_string())?;
    let mut env = vm.attach_current_thread().map_err(|e| e.to_string())?;
    // SAFETY: as above; the reference is global for the activity's life.
    let context = unsafe { JObject::from_raw(ctx.context().cast()) };
    let result = f(&mut env, &context);
    if env.exception_check().unwrap_or(false) {
        let _ = env.exception_describe();
        let _ = env.exception_clear();
    }
    result.map_err(|e| e.to_string())
}

/// Put `text` on the system clipboard.
pub fn copy_text(text: &str) -> Result<(), String> {
    with_context(|env, context| {
        let service = env.new_string("clipboard")?;
        let manager = env
            .call_method(
                context,
                "getSystemService",
                "(Ljava/lang/String;)Ljava/lang/Object;",
                &[JValue::Object(&service)],
            )?
            .l()?;
        let label = env.new_string("Turnsheet plan")?;
        let body = env.new_string(text)?;
        let clip = env
            .call_static_method(
                "android/content/ClipData",
                "newPlainText",
                "(Ljava/lang/CharSequence;Ljava/lang/CharSequence;)Landroid/content/ClipData;",
                &[JValue::Object(&label), JValue::Object(&body)],
            )?
            .l()?;
        env.call_method(
            &manager,
            "setPrimaryClip",
            "(Landroid/content/ClipData;)V",
            &[JValue::Object(&clip)],
        )?;
        Ok(())
    })
}

/// Write `bytes` as `name` into Downloads/Turnsheet through the media store; the place as
/// the phone's file apps show it ("Download/Turnsheet/NAME").
pub fn save_download(name: &str, mime: &str, bytes: &[u8]) -> Result<String, String> {
    let folder = format!("Download/{DOWNLOADS_FOLDER}");
    with_context(|env, context| {
        let values = env.new_object("android/content/ContentValues", "()V", &[])?;
        for (key, value) in [
            ("_display_name", name),
            ("mime_type", mime),
            ("relative_path", folder.as_str()),
        ] {
            let k = env.new_string(key)?;
            let v = env.new_string(value)?;
            env.call_method(
                &values,
                "put",
                "(Ljava/lang/String;Ljava/lang/String;)V",
                &[JValue::Object(&k), JValue::Object(&v)],
            )?;
        }
        // Pending while it is written: an interrupted write leaves an entry the system
        // removes, never half a card.
        put_int(env, &values, "is_pending", 1)?;
        let resolver = env
            .call_method(
                context,
                "getContentResolver",
                "()Landroid/content/ContentResolver;",
                &[],
            )?
            .l()?;
        let downloads = env
            .get_static_field(
                "android/provider/MediaStore$Downloads",
                "EXTERNAL_CONTENT_URI",
                "Landroid/net/Uri;",
            )?
            .l()?;
        let item = env
            .call_method(
                &resolver,
                "insert",
                "(Landroid/net/Uri;Landroid/content/ContentValues;)Landroid/net/Uri;",
                &[JValue::Object(&downloads), JValue::Object(&values)],
            )?
            .l()?;
        if item.is_null() {
            return Err(jni::errors::Error::NullPtr("the media store gave no entry"));
        }
        let out = env
            .call_method(
                &resolver,
                "openOutputStream",
                "(Landroid/net/Uri;)Ljava/io/OutputStream;",
                &[JValue::Object(&item)],
            )?
            .l()?;
        let data = env.byte_array_from_slice(bytes)?;
        let written = env
            .call_method(&out, "write", "([B)V", &[JValue::Object(&data)])
            .and_then(|_| env.call_method(&out, "close", "()V", &[]));
        if let Err(e) = written {
            // Take the unfinished entry away again; the error is what the caller hears.
            if env.exception_check().unwrap_or(false) {
                let _ = env.exception_clear();
            }
            let none = JObject::null();
            let _ = env.call_method(
                &resolver,
                "delete",
                "(Landroid/net/Uri;Ljava/lang/String;[Ljava/lang/String;)I",
                &[
                    JValue::Object(&item),
                    JValue::Object(&none),
                    JValue::Object(&none),
                ],
            );
            return Err(e);
        }
        let done = env.new_object("android/content/ContentValues", "()V", &[])?;
        put_int(env, &done, "is_pending", 0)?;
        let none = JObject::null();
        env.call_method(
            &resolver,
            "update",
            "(Landroid/net/Uri;Landroid/content/ContentValues;Ljava/lang/String;[Ljava/lang/String;)I",
            &[
                JValue::Object(&item),
                JValue::Object(&done),
                JValue::Object(&none),
                JValue::Object(&none),
            ],
        )?;
        Ok(())
    })?;
    Ok(format!("{folder}/{name}"))
}

/// `values.put(key, Integer.valueOf(n))`.
fn put_int(env: &mut JNIEnv, values: &JObject, key: &str, n: i32) -> jni::errors::Result<()> {
    let k = env.new_string(key)?;
    let v = env
        .call_static_method(
            "java/lang/Integer",
            "valueOf",
            "(I)Ljava/lang/Integer;",
            &[JValue::Int(n)],
        )?
        .l()?;
    env.call_method(
        values,
        "put",
        "(Ljava/lang/String;Ljava/lang/Integer;)V",
        &[JValue::Object(&k), JValue::Object(&v)],
    )?;
    Ok(())
}
