// Saving generated text or an image from the browser as a file.

/** Offers `content` (text, a Blob or a data: URL) as a download named `fileName`. */
export function useDownload() {
  function save(fileName: string, content: string | Blob, type = 'text/plain;charset=utf-8') {
    const isDataUrl = typeof content === 'string' && content.startsWith('data:')
    const url = isDataUrl ? content : URL.createObjectURL(content instanceof Blob ? content : new Blob([content], { type }))
    const link = document.createElement('a')
    link.href = url
    link.download = fileName
    document.body.appendChild(link)
    link.click()
    link.remove()
    if (!isDataUrl) setTimeout(() => URL.revokeObjectURL(url), 1000)
  }
  return { save }
}
