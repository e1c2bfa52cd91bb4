// POST a multipart form and report how much of it has been sent, which fetch
// cannot do (it has no upload progress); XMLHttpRequest can. A reply outside
// 2xx is thrown shaped like $fetch's error ({ statusCode, data: the JSON body }),
// so pages handle both the same way.
export interface UploadError { statusCode: number, statusMessage: string, message: string, data: unknown }

export function uploadForm<T>(url: string, form: FormData, onProgress?: (sent: number, total: number) => void): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest()
    xhr.open('POST', url)
    xhr.setRequestHeader('accept', 'application/json')
    xhr.responseType = 'text'
    if (onProgress) {
      let total = 0
      xhr.upload.onprogress = (e) => {
        if (!e.lengthComputable) return
        total = e.total
        onProgress(e.loaded, e.total)
      }
      // all of it is sent: the server now works on it until it answers
      xhr.upload.onload = (e) => {
        const t = e.lengthComputable ? e.total : total
        onProgress(t, t)
      }
    }
    xhr.onload = () => {
      let body: unknown = xhr.responseText
      try {
        body = JSON.parse(xhr.responseText)
      }
      catch { /* not JSON: keep the text */ }
      if (xhr.status >= 200 && xhr.status < 300) { resolve(body as T); return }
      const b = (body && typeof body === 'object' ? body : {}) as { message?: string, statusMessage?: string }
      const error: UploadError = { statusCode: xhr.status, statusMessage: b.statusMessage ?? xhr.statusText, message: b.message ?? `The server answered ${xhr.status}.`, data: body }
      reject(error)
    }
    xhr.onerror = () => reject({ statusCode: 0, statusMessage: '', message: 'The table could not be sent: the server did not answer. Check the connection and try again.', data: null } satisfies UploadError)
    xhr.send(form)
  })
}
